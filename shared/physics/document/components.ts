// Each component's internals as short straight channels, in SI. Arms run from each terminal to a centre node
// (positive flow = towards the centre); a flow-focusing outlet passes its orifice first; a serpentine is one
// channel of its total length; a step array is a ladder (margin, (N − 1) pitches, margin — its drawn length): the supply and the reservoir are cut at every nozzle,
// so the manifold's own pressure drop shows in the nozzles' uniformity.
import type { Component } from '../../schemas/chip'
import type { CompiledChannel, CompiledJunction } from './types'

const UM = 1e-6

export interface ComponentContext {
  /** Node of one of this component's terminals. */
  terminal: (name: string) => string
  /** Layer depth in µm. */
  depth: (layerId: string) => number
  channels: CompiledChannel[]
  junctions: CompiledJunction[]
}

function pipe(
  ctx: ComponentContext,
  c: Component,
  part: string,
  from: string,
  to: string,
  widthUm: number,
  lengthUm: number,
  layerId: string,
): number {
  ctx.channels.push({
    id: `${c.id}/${part}`,
    element: c.id,
    from,
    to,
    width: widthUm * UM,
    depth: ctx.depth(layerId) * UM,
    length: lengthUm * UM,
  })
  return ctx.channels.length - 1
}

/** Geometry key: identical parameters (position, rotation and names aside) mean "meant to carry equal flow". */
function parallelKey(c: Component): string {
  let key = ''
  for (const [field, value] of Object.entries(c)) {
    if (field !== 'id' && field !== 'name' && field !== 'position' && field !== 'rotation')
      key += `${field}=${String(value)};`
  }
  return key
}

export function compileComponent(c: Component, ctx: ComponentContext): void {
  const centre = `${c.id}:centre`
  const arm = (terminal: string, widthUm: number, lengthUm: number, layerId = c.layerId) =>
    pipe(ctx, c, terminal, ctx.terminal(terminal), centre, widthUm, lengthUm, layerId)
  const depthUm = ctx.depth(c.layerId)
  /** Three arms meeting at the centre; the junction's forecast widths are its main (outlet) and dispersed inlet. */
  const threeArms = (
    kind: 't-junction' | 'y-junction',
    armLength: number,
    widths: { continuous: number; dispersed: number; outlet: number },
  ) => {
    const continuous = arm('continuous', widths.continuous, armLength)
    const dispersed = arm('dispersed', widths.dispersed, armLength)
    arm('outlet', widths.outlet, armLength)
    ctx.junctions.push({
      id: c.id,
      kind,
      element: c.id,
      mainWidth: widths.outlet * UM,
      inletWidth: widths.dispersed * UM,
      depth: depthUm * UM,
      dispersed,
      continuous: [continuous],
      continuousRule: 'sum',
      parallelKey: parallelKey(c),
    })
  }
  switch (c.kind) {
    case 't-junction':
      threeArms(c.kind, c.armLength, { continuous: c.mainWidth, dispersed: c.inletWidth, outlet: c.mainWidth })
      return
    case 'y-junction':
      // Forecast as a T-junction whose main channel is the outlet (see document/junctions.ts).
      threeArms(c.kind, c.armLength, {
        continuous: c.continuousWidth,
        dispersed: c.dispersedWidth,
        outlet: c.outletWidth,
      })
      return
    case 'flow-focusing': {
      const dispersed = arm('dispersed', c.dispersedWidth, c.armLength)
      const a = arm('continuous-a', c.continuousWidth, c.armLength)
      const b = arm('continuous-b', c.continuousWidth, c.armLength)
      const orificeExit = `${c.id}:orifice`
      pipe(ctx, c, 'orifice', centre, orificeExit, c.orificeWidth, c.orificeLength, c.layerId)
      pipe(ctx, c, 'outlet', ctx.terminal('outlet'), orificeExit, c.outletWidth, c.armLength, c.layerId)
      ctx.junctions.push({
        id: c.id,
        kind: c.kind,
        element: c.id,
        mainWidth: c.orificeWidth * UM,
        inletWidth: c.dispersedWidth * UM,
        depth: depthUm * UM,
        dispersed,
        continuous: [a, b],
        continuousRule: 'sum',
        parallelKey: parallelKey(c),
      })
      return
    }
    case 'step-nozzle': {
      const dispersed = arm('dispersed', c.nozzleWidth, c.nozzleLength)
      const upstream = arm('continuous', c.reservoirWidth, c.reservoirLength / 2, c.reservoirLayerId)
      const downstream = arm('outlet', c.reservoirWidth, c.reservoirLength / 2, c.reservoirLayerId)
      ctx.junctions.push({
        id: c.id,
        kind: c.kind,
        element: c.id,
        mainWidth: c.nozzleWidth * UM,
        inletWidth: c.nozzleWidth * UM,
        depth: depthUm * UM,
        dispersed,
        continuous: [upstream, downstream],
        continuousRule: 'largest',
        parallelKey: parallelKey(c),
      })
      return
    }
    case 'step-array': {
      const n = c.nozzleCount
      const supply = (k: number) => `${c.id}:s${k}`
      const reservoir = (k: number) => `${c.id}:r${k}`
      const key = parallelKey(c)
      const reservoirSegment: number[] = []
      pipe(ctx, c, 'supply-0', ctx.terminal('dispersed'), supply(0), c.supplyWidth, c.margin, c.supplyLayerId)
      reservoirSegment.push(
        pipe(
          ctx,
          c,
          'reservoir-0',
          ctx.terminal('continuous'),
          reservoir(0),
          c.reservoirWidth,
          c.margin,
          c.reservoirLayerId,
        ),
      )
      for (let k = 1; k < n; k++) {
        pipe(ctx, c, `supply-${k}`, supply(k - 1), supply(k), c.supplyWidth, c.pitch, c.supplyLayerId)
        reservoirSegment.push(
          pipe(ctx, c, `reservoir-${k}`, reservoir(k - 1), reservoir(k), c.reservoirWidth, c.pitch, c.reservoirLayerId),
        )
      }
      pipe(ctx, c, `supply-${n}`, supply(n - 1), ctx.terminal('dispersed-b'), c.supplyWidth, c.margin, c.supplyLayerId)
      reservoirSegment.push(
        pipe(
          ctx,
          c,
          `reservoir-${n}`,
          reservoir(n - 1),
          ctx.terminal('outlet'),
          c.reservoirWidth,
          c.margin,
          c.reservoirLayerId,
        ),
      )
      for (let k = 0; k < n; k++) {
        const nozzle = pipe(ctx, c, `nozzle-${k}`, supply(k), reservoir(k), c.nozzleWidth, c.nozzleLength, c.layerId)
        ctx.junctions.push({
          id: `${c.id}[${k}]`,
          kind: c.kind,
          element: c.id,
          nozzle: k,
          mainWidth: c.nozzleWidth * UM,
          inletWidth: c.nozzleWidth * UM,
          depth: depthUm * UM,
          dispersed: nozzle,
          continuous: [reservoirSegment[k]!, reservoirSegment[k + 1]!],
          continuousRule: 'largest',
          parallelKey: key,
        })
      }
      return
    }
    case 'serpentine':
      pipe(ctx, c, 'run', ctx.terminal('inlet'), ctx.terminal('outlet'), c.width, c.totalLength, c.layerId)
      return
  }
}
