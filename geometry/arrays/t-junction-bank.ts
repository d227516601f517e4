import type { Elements } from './elements'

export interface TJunctionBankArgs {
  bank: number
  count: number
  /** Junction pitch along y, µm. */
  pitch: number
  mainWidth: number
  inletWidth: number
  armLength: number
  /** Continuous branch: manifold centre line to the junction's continuous terminal, µm. */
  continuousBranch: number
  /** Dispersed branch: manifold centre line to the junction's dispersed terminal (both legs), µm. */
  dispersedBranch: number
  /** Outlet channel: junction outlet terminal to the centre of its punch, µm. */
  outletLength: number
  continuousManifoldWidth: number
  dispersedManifoldWidth: number
  punch: number
  /** Clearance from an outlet punch to the dispersed manifold's wall, µm. */
  clearance: number
}

/**
 * Where a bank's parts sit along x (bank frame: continuous manifold at x = 0, junction k at y = k·pitch).
 * The dispersed manifold lies beyond the outlet punches, at least `clearance` from them, and far enough
 * that the dispersed branch has the requested length.
 */
export function tJunctionBankColumns(a: TJunctionBankArgs): { xj: number; xo: number; xd: number; rise: number } {
  const xj = a.continuousBranch + a.armLength
  const xo = xj + a.armLength + a.outletLength
  const rise = a.pitch / 2 // the dispersed branch runs half-way between two rows of junctions
  const xd = Math.max(
    xo + a.punch / 2 + a.clearance + a.dispersedManifoldWidth / 2,
    xj + a.dispersedBranch - (rise - a.armLength),
  )
  return { xj, xo, xd, rise }
}

/**
 * One bank of T-junctions stacked along +y. Both supply manifolds run on the deep layer: the continuous one at
 * x = 0 sends a branch along +x into each junction's continuous arm; the dispersed one, beyond the outlets,
 * sends a branch back along −x half-way between rows, which turns down into the junction's side arm. Each
 * junction's outlet runs to its own punch; the punches stand in one straight row at the same x, so one
 * collection well over that row gathers every outlet.
 *
 * Why not a third, on-chip collection manifold: contracting each connected manifold to a point turns three
 * manifolds each joined to N junctions into the complete bipartite graph K(3,N), which has no planar drawing
 * for N ≥ 3 (Kuratowski 1930, Fund. Math. 15, 271); a one-level mould is planar, so one of the three networks
 * must leave the chip. Outlets at atmospheric pressure are the one whose leaving costs no uniformity.
 */
export function tJunctionBankElements(a: TJunctionBankArgs): Elements {
  const id = (s: string) => `b${a.bank}-${s}`
  const j = (k: number) => id(`tj${k}`)
  const y = (k: number) => k * a.pitch
  const { xj, xo, xd, rise } = tJunctionBankColumns(a)
  const last = a.count - 1
  const feedY = -(a.pitch / 2 + a.punch + a.clearance) // inlet punches below the first row
  const out: Elements = { ports: [], components: [], channels: [], inlets: [] }

  for (let k = 0; k < a.count; k++) {
    out.components.push({
      id: j(k),
      kind: 't-junction',
      position: { x: xj, y: y(k) },
      rotation: 0,
      layerId: 'junction',
      mainWidth: a.mainWidth,
      inletWidth: a.inletWidth,
      armLength: a.armLength,
    })
    out.ports.push({
      id: id(`out${k}`),
      kind: 'outlet',
      position: { x: xo, y: y(k) },
      punchDiameter: a.punch,
      layerId: 'junction',
    })
    out.channels.push(
      {
        id: id(`cb${k}`),
        layerId: 'junction',
        width: a.mainWidth,
        points: [
          { x: 0, y: y(k) },
          { x: xj - a.armLength, y: y(k) },
        ],
        end: { element: j(k), terminal: 'continuous' },
      },
      {
        id: id(`db${k}`),
        layerId: 'junction',
        width: a.inletWidth,
        points: [
          { x: xd, y: y(k) + rise },
          { x: xj, y: y(k) + rise },
          { x: xj, y: y(k) + a.armLength },
        ],
        end: { element: j(k), terminal: 'dispersed' },
      },
      {
        id: id(`ob${k}`),
        layerId: 'junction',
        width: a.mainWidth,
        points: [
          { x: xj + a.armLength, y: y(k) },
          { x: xo, y: y(k) },
        ],
        start: { element: j(k), terminal: 'outlet' },
        end: { element: id(`out${k}`), terminal: 'port' },
      },
    )
    if (k === last) continue
    out.channels.push(
      {
        id: id(`cm${k}`),
        layerId: 'deep',
        width: a.continuousManifoldWidth,
        points: [
          { x: 0, y: y(k) },
          { x: 0, y: y(k + 1) },
        ],
      },
      {
        id: id(`dm${k}`),
        layerId: 'deep',
        width: a.dispersedManifoldWidth,
        points: [
          { x: xd, y: y(k) + rise },
          { x: xd, y: y(k + 1) + rise },
        ],
      },
    )
  }
  const contIn = { x: 0, y: feedY }
  const dispIn = { x: xd, y: feedY }
  out.ports.push(
    {
      id: id('cont-in'),
      kind: 'inlet',
      position: contIn,
      punchDiameter: a.punch,
      layerId: 'deep',
      feed: { phase: 'continuous' },
    },
    {
      id: id('disp-in'),
      kind: 'inlet',
      position: dispIn,
      punchDiameter: a.punch,
      layerId: 'deep',
      feed: { phase: 'dispersed' },
    },
  )
  out.channels.push(
    {
      id: id('cont-feed'),
      layerId: 'deep',
      width: a.continuousManifoldWidth,
      points: [contIn, { x: 0, y: 0 }],
      start: { element: id('cont-in'), terminal: 'port' },
    },
    {
      id: id('disp-feed'),
      layerId: 'deep',
      width: a.dispersedManifoldWidth,
      points: [dispIn, { x: xd, y: rise }],
      start: { element: id('disp-in'), terminal: 'port' },
    },
  )
  return out
}
