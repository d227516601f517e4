import type { Component } from './components'
import { serpentineRunLength, stepArrayLength } from './components'
import type { Port } from './ports'
import type { Point } from './primitives'
import { rotateDirection, toWorld } from './transform'

// The ONE place where each component kind names its terminals and says where they sit. Channels attach to
// terminals by name; the outlines in geometry/ and the network in shared/physics read positions from here.

export type TerminalRole = 'continuous' | 'dispersed' | 'outlet' | 'inlet' | 'port'

export interface Terminal {
  name: string
  role: TerminalRole
  /** World position in µm, at the open end of the arm. */
  position: Point
  /** Unit vector pointing out of the element, along the arm (zero for a port). */
  direction: Point
  /** Width of the channel that should attach here, µm. */
  width: number
  layerId: string
}

type Local = Omit<Terminal, 'position' | 'direction'> & { at: Point; dir: Point }

const polar = (length: number, deg: number): Point => ({
  x: length * Math.cos((deg * Math.PI) / 180),
  y: length * Math.sin((deg * Math.PI) / 180),
})

function localTerminals(c: Component): Local[] {
  switch (c.kind) {
    case 't-junction':
      return [
        {
          name: 'continuous',
          role: 'continuous',
          at: { x: -c.armLength, y: 0 },
          dir: { x: -1, y: 0 },
          width: c.mainWidth,
          layerId: c.layerId,
        },
        {
          name: 'dispersed',
          role: 'dispersed',
          at: { x: 0, y: c.armLength },
          dir: { x: 0, y: 1 },
          width: c.inletWidth,
          layerId: c.layerId,
        },
        {
          name: 'outlet',
          role: 'outlet',
          at: { x: c.armLength, y: 0 },
          dir: { x: 1, y: 0 },
          width: c.mainWidth,
          layerId: c.layerId,
        },
      ]
    case 'flow-focusing': {
      const outletEnd = c.continuousWidth / 2 + c.orificeLength + c.armLength
      return [
        {
          name: 'dispersed',
          role: 'dispersed',
          at: { x: -c.armLength, y: 0 },
          dir: { x: -1, y: 0 },
          width: c.dispersedWidth,
          layerId: c.layerId,
        },
        {
          name: 'continuous-a',
          role: 'continuous',
          at: { x: 0, y: c.armLength },
          dir: { x: 0, y: 1 },
          width: c.continuousWidth,
          layerId: c.layerId,
        },
        {
          name: 'continuous-b',
          role: 'continuous',
          at: { x: 0, y: -c.armLength },
          dir: { x: 0, y: -1 },
          width: c.continuousWidth,
          layerId: c.layerId,
        },
        {
          name: 'outlet',
          role: 'outlet',
          at: { x: outletEnd, y: 0 },
          dir: { x: 1, y: 0 },
          width: c.outletWidth,
          layerId: c.layerId,
        },
      ]
    }
    case 'y-junction': {
      const up = 180 - c.angle / 2
      const down = 180 + c.angle / 2
      return [
        {
          name: 'continuous',
          role: 'continuous',
          at: polar(c.armLength, up),
          dir: polar(1, up),
          width: c.continuousWidth,
          layerId: c.layerId,
        },
        {
          name: 'dispersed',
          role: 'dispersed',
          at: polar(c.armLength, down),
          dir: polar(1, down),
          width: c.dispersedWidth,
          layerId: c.layerId,
        },
        {
          name: 'outlet',
          role: 'outlet',
          at: { x: c.armLength, y: 0 },
          dir: { x: 1, y: 0 },
          width: c.outletWidth,
          layerId: c.layerId,
        },
      ]
    }
    case 'step-nozzle': {
      const x = c.nozzleLength + c.reservoirWidth / 2
      return [
        {
          name: 'dispersed',
          role: 'dispersed',
          at: { x: 0, y: 0 },
          dir: { x: -1, y: 0 },
          width: c.nozzleWidth,
          layerId: c.layerId,
        },
        {
          name: 'continuous',
          role: 'continuous',
          at: { x, y: -c.reservoirLength / 2 },
          dir: { x: 0, y: -1 },
          width: c.reservoirWidth,
          layerId: c.reservoirLayerId,
        },
        {
          name: 'outlet',
          role: 'outlet',
          at: { x, y: c.reservoirLength / 2 },
          dir: { x: 0, y: 1 },
          width: c.reservoirWidth,
          layerId: c.reservoirLayerId,
        },
      ]
    }
    case 'step-array': {
      const half = stepArrayLength(c) / 2
      const xs = -c.supplyWidth / 2
      const xr = c.nozzleLength + c.reservoirWidth / 2
      return [
        {
          name: 'dispersed',
          role: 'dispersed',
          at: { x: xs, y: -half },
          dir: { x: 0, y: -1 },
          width: c.supplyWidth,
          layerId: c.supplyLayerId,
        },
        {
          name: 'dispersed-b',
          role: 'dispersed',
          at: { x: xs, y: half },
          dir: { x: 0, y: 1 },
          width: c.supplyWidth,
          layerId: c.supplyLayerId,
        },
        {
          name: 'continuous',
          role: 'continuous',
          at: { x: xr, y: -half },
          dir: { x: 0, y: -1 },
          width: c.reservoirWidth,
          layerId: c.reservoirLayerId,
        },
        {
          name: 'outlet',
          role: 'outlet',
          at: { x: xr, y: half },
          dir: { x: 0, y: 1 },
          width: c.reservoirWidth,
          layerId: c.reservoirLayerId,
        },
      ]
    }
    case 'serpentine': {
      const run = serpentineRunLength(c)
      const even = c.turns % 2 === 0
      return [
        { name: 'inlet', role: 'inlet', at: { x: 0, y: 0 }, dir: { x: -1, y: 0 }, width: c.width, layerId: c.layerId },
        {
          name: 'outlet',
          role: 'outlet',
          at: { x: even ? run : 0, y: c.turns * c.pitch },
          dir: { x: even ? 1 : -1, y: 0 },
          width: c.width,
          layerId: c.layerId,
        },
      ]
    }
  }
}

/** Named terminals of a component, placed in world coordinates (µm). */
export function componentTerminals(c: Component): Terminal[] {
  return localTerminals(c).map(({ at, dir, ...rest }) => ({
    ...rest,
    position: toWorld(at, c.position, c.rotation),
    direction: rotateDirection(dir, c.rotation),
  }))
}

/** A port has a single terminal, `port`, at its centre. */
export function portTerminals(p: Port): Terminal[] {
  return [
    {
      name: 'port',
      role: 'port',
      position: { ...p.position },
      direction: { x: 0, y: 0 },
      width: p.punchDiameter,
      layerId: p.layerId,
    },
  ]
}

/** Terminal names per element id, for reference checks. */
export function terminalNames(c: Component | Port): string[] {
  return 'punchDiameter' in c ? ['port'] : localTerminals(c).map(t => t.name)
}
