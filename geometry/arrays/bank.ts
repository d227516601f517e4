import type { Elements } from './elements'

interface BankArgs {
  bank: number
  x0: number
  y0: number
  count: number
  pitch: number
  nozzleWidth: number
  nozzleLength: number
  reservoirWidth: number
  manifoldWidth: number
}

/**
 * One ladder: step nozzles stacked along +y at `pitch`; the deep supply manifold runs through every nozzle's
 * entry (x = x0), the shallow nozzles reach to the deep collection channel, which carries the continuous phase
 * past every nozzle to the outlet. The shallow nozzle starts under the manifold (half its width) so the
 * exposed nozzle length is `nozzleLength`; overlapping the two layers is how two-layer moulds tolerate
 * alignment error (common practice, no source).
 */
export function bankElements(a: BankArgs): Elements {
  const id = (s: string) => `b${a.bank}-${s}`
  const nozzle = (k: number) => id(`n${k}`)
  const y = (k: number) => a.y0 + k * a.pitch
  const lc = a.nozzleLength + a.manifoldWidth / 2
  const xr = a.x0 + lc + a.reservoirWidth / 2
  const q = (3 * a.pitch) / 8 // half the reservoir length (3/4 of the pitch)
  const last = a.count - 1
  const out: Elements = { ports: [], components: [], channels: [], inlets: [] }

  for (let k = 0; k < a.count; k++) {
    out.components.push({
      id: nozzle(k),
      kind: 'step-nozzle',
      position: { x: a.x0, y: y(k) },
      rotation: 0,
      layerId: 'nozzle',
      reservoirLayerId: 'deep',
      nozzleWidth: a.nozzleWidth,
      nozzleLength: lc,
      reservoirWidth: a.reservoirWidth,
      reservoirLength: (3 * a.pitch) / 4,
    })
    if (k === last) continue
    out.channels.push(
      {
        id: id(`sup${k}`),
        layerId: 'deep',
        width: a.manifoldWidth,
        points: [
          { x: a.x0, y: y(k) },
          { x: a.x0, y: y(k + 1) },
        ],
        start: { element: nozzle(k), terminal: 'dispersed' },
        end: { element: nozzle(k + 1), terminal: 'dispersed' },
      },
      {
        id: id(`col${k}`),
        layerId: 'deep',
        width: a.reservoirWidth,
        points: [
          { x: xr, y: y(k) + q },
          { x: xr, y: y(k + 1) - q },
        ],
        start: { element: nozzle(k), terminal: 'outlet' },
        end: { element: nozzle(k + 1), terminal: 'continuous' },
      },
    )
  }
  const dispIn = { x: a.x0, y: a.y0 - 1500 }
  const contIn = { x: xr + 2000, y: a.y0 - 1500 }
  const outlet = { x: xr, y: y(last) + 1500 }
  out.ports.push(
    {
      id: id('disp-in'),
      kind: 'inlet',
      position: dispIn,
      punchDiameter: 1000,
      layerId: 'deep',
      feed: { phase: 'dispersed' },
    },
    {
      id: id('cont-in'),
      kind: 'inlet',
      position: contIn,
      punchDiameter: 1000,
      layerId: 'deep',
      feed: { phase: 'continuous' },
    },
    { id: id('out'), kind: 'outlet', position: outlet, punchDiameter: 1000, layerId: 'deep' },
  )
  out.channels.push(
    {
      id: id('disp-feed'),
      layerId: 'deep',
      width: a.manifoldWidth,
      points: [dispIn, { x: a.x0, y: a.y0 }],
      start: { element: id('disp-in'), terminal: 'port' },
      end: { element: nozzle(0), terminal: 'dispersed' },
    },
    {
      id: id('cont-feed'),
      layerId: 'deep',
      width: a.reservoirWidth,
      points: [contIn, { x: contIn.x, y: a.y0 - 600 }, { x: xr, y: a.y0 - 600 }, { x: xr, y: a.y0 - q }],
      start: { element: id('cont-in'), terminal: 'port' },
      end: { element: nozzle(0), terminal: 'continuous' },
    },
    {
      id: id('drain'),
      layerId: 'deep',
      width: a.reservoirWidth,
      points: [{ x: xr, y: y(last) + q }, outlet],
      start: { element: nozzle(last), terminal: 'outlet' },
      end: { element: id('out'), terminal: 'port' },
    },
  )
  out.inlets.push(
    { portId: id('disp-in'), mode: 'pressure', value: 150, unit: 'mbar' },
    { portId: id('cont-in'), mode: 'flow', value: 20, unit: 'uL/min' },
  )
  return out
}
