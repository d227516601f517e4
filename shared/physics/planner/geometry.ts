// Geometry suggestions: for each junction kind, the sizes that make the target drop by the forecast's own size
// law, with the operating point that keeps it inside that law's regime, checked against the fabrication process.
//
// Each kind is a one-parameter family of shapes (every length proportional to a scale s) run at a fixed capillary
// number and flow ratio; in the confined laws the drop size is then proportional to s (Garstecki et al. 2006,
// Lab Chip 6, 437: L/w = 1 + α Qd/Qc; van Steijn, Kleijn & Kreutzer 2010, Lab Chip 10, 2513; step: d ≈ 4 h,
// Dangla, Kayi & Baroud 2013, PNAS 110, 853), so s is found by bisection on the forecast itself and stays right
// when the forecast's laws improve.
import type { FabricationProcess } from '../../../geometry/rules/types'
import type { ResolvedJunction } from '../forecast/types'
import type { JunctionKind } from '../junction/regime'
import { SQUEEZING_BAND, STEP_BAND } from '../junction/regime'
import { STEP_MIN_ASPECT } from '../junction/step'
import { quantity, type Method, type Quantity } from '../quantity'
import { UNIT } from '../units'
import { bisectLog } from './grid'
import { forecastAt } from './junctionScan'
import type { PlanTarget } from './types'

export const GEOMETRY_FAMILY: Method = {
  id: 'planner-geometry-family',
  source:
    "a shape family scaled until the forecast gives the target size, at a capillary number 0.8 × the lower edge of the kind's regime band " +
    '(T-junction squeezing: De Menech, Garstecki, Jousse & Stone 2008, J. Fluid Mech. 595, 141; step: Li et al. 2015, Lab Chip 15, 1023); ' +
    'shape ratios and the margin 0.8 are common practice, no source',
}

/** Liquids and conditions of the request: a junction with its geometry and flows to be set here. */
export type Liquids = Omit<
  ResolvedJunction,
  'kind' | 'mainWidth' | 'inletWidth' | 'depth' | 'flowContinuous' | 'flowDispersed'
>

interface Family {
  kind: JunctionKind
  /** Widths and depth at scale s (m); `minFeature` in m keeps a width at least printable. */
  shape: (s: number, minFeature: number) => { mainWidth: number; inletWidth: number; depth: number }
  /** Flows (m³/s) at the chosen capillary number. */
  flows: (g: { mainWidth: number; inletWidth: number; depth: number }, l: Liquids) => { qc: number; qd: number }
  capillary: number
  validity: string
  why: string
}

const tension = (l: Liquids) => l.interfacialTension.value
const FAMILIES: Family[] = [
  {
    kind: 't-junction',
    // The inlet is widened to the process's minimum feature when 0.6 s would be too fine (still inside win/w ≤ 3).
    shape: (s, minFeature) => ({
      mainWidth: s,
      inletWidth: Math.min(Math.max(0.6 * s, minFeature), 3 * s),
      depth: 0.45 * s,
    }),
    capillary: 0.8 * SQUEEZING_BAND[0],
    // Ca = μc Qc / (w h γ) in the main channel; equal flows (Qd/Qc = 1).
    flows: (g, l) => {
      const qc = (0.8 * SQUEEZING_BAND[0] * tension(l) * g.mainWidth * g.depth) / l.continuous.viscosity.value
      return { qc, qd: qc }
    },
    validity:
      'squeezing regime (Ca < 0.01, De Menech et al. 2008); h/w ≤ 0.5 and 1/3 ≤ win/w ≤ 3 for the van Steijn et al. 2010 law (here h/w = 0.45, win/w = 0.6, or wider to print)',
    why: 'depth 0.45 × width and inlet 0.6 × width keep the van Steijn et al. 2010 squeezing law valid; the drop is a plug about 1–2 channel widths long',
  },
  {
    kind: 'flow-focusing',
    shape: s => ({ mainWidth: s, inletWidth: s, depth: s }),
    capillary: 0.8 * SQUEEZING_BAND[0],
    flows: (g, l) => {
      const qc = (0.8 * SQUEEZING_BAND[0] * tension(l) * g.mainWidth * g.depth) / l.continuous.viscosity.value
      return { qc, qd: 0.25 * qc }
    },
    validity:
      'confined drops at low Ca (≲ 0.01) in the orifice; the linear law has low confidence unless α is fitted (factor ~1.5)',
    why: 'a square orifice (depth = width) at Qd/Qc = 0.25; fit α from measured drops before trusting the size to better than a factor 1.5',
  },
  {
    kind: 'step',
    shape: (s, minFeature) => {
      const w = Math.max(3 * s, minFeature)
      return { mainWidth: w, inletWidth: w, depth: s }
    },
    capillary: 0.8 * STEP_BAND[0],
    // Ca = μd Qd / (w h γ) in the nozzle; the continuous phase only sweeps the reservoir (4 × Qd).
    flows: (g, l) => {
      const qd = (0.8 * STEP_BAND[0] * tension(l) * g.mainWidth * g.depth) / l.dispersed.viscosity.value
      return { qc: 4 * qd, qd }
    },
    validity: `below the critical nozzle capillary number (≈ 0.01–0.03, Li et al. 2015); nozzle width/depth ≥ ${STEP_MIN_ASPECT} (Montessori et al.); continuous phase wets the nozzle`,
    why: `nozzle depth ≈ d/4 sets the size almost independently of flow; width 3 × depth (≥ ${STEP_MIN_ASPECT}) so drops pinch at the step; add nozzles for rate`,
  },
]

export interface GeometrySuggestion {
  kind: JunctionKind
  junction: { mainWidth: Quantity; inletWidth: Quantity; depth: Quantity }
  /** Junctions (step: nozzles) in parallel for the wanted rate, each at the flows below. */
  count: number
  /** Step arrays: nozzle pitch. */
  pitch?: Quantity
  flow: { continuous: Quantity; dispersed: Quantity }
  expected: {
    dropletDiameter: Quantity
    frequency: Quantity
    totalFrequency: Quantity
    capillaryNumber: Quantity
    regime: string
  }
  law: { method: string; source: string }
  validity: string
  reason: string
  process: { id: string; name: string; ok: boolean; problems: string[] }
  /** The size law is valid there and the process accepts the sizes. */
  valid: boolean
}

/** Rounds a length to what a mask and a profilometer can hold: 0.25 µm below 20 µm, else 1 µm (common practice, no source). */
export const roundLength = (m: number): number => (m < 20e-6 ? Math.round(m * 4e6) / 4e6 : Math.round(m * 1e6) / 1e6)

function processProblems(
  kind: JunctionKind,
  g: { mainWidth: number; inletWidth: number; depth: number },
  pitch: number | undefined,
  p: FabricationProcess,
): string[] {
  const um = (m: number) => +(m * 1e6).toPrecision(4)
  const problems: string[] = []
  const widths: [string, number][] =
    kind === 'step'
      ? [['nozzle width', g.mainWidth]]
      : [
          [kind === 'flow-focusing' ? 'orifice width' : 'main width', g.mainWidth],
          ['inlet width', g.inletWidth],
        ]
  for (const [name, w] of widths) {
    if (um(w) < p.minFeature)
      problems.push(`${name} ${um(w)} µm is below the process's minimum feature of ${p.minFeature} µm`)
    if (um(w) / um(g.depth) > p.maxWidthToDepth)
      problems.push(
        `${name} ${um(w)} µm is more than ${p.maxWidthToDepth} × the depth ${um(g.depth)} µm: the roof may sag`,
      )
  }
  if (um(g.depth) < p.minDepth) problems.push(`depth ${um(g.depth)} µm is below the process's ${p.minDepth} µm`)
  if (um(g.depth) > p.maxDepth) problems.push(`depth ${um(g.depth)} µm is above the process's ${p.maxDepth} µm`)
  if (pitch !== undefined && um(pitch - g.mainWidth) < p.minGap)
    problems.push(
      `the wall between nozzles (${um(pitch - g.mainWidth)} µm) is below the process's minimum gap of ${p.minGap} µm`,
    )
  return problems
}

function suggest(
  f: Family,
  liquids: Liquids,
  target: PlanTarget,
  process: FabricationProcess,
): GeometrySuggestion | null {
  const minFeature = process.minFeature * 1e-6
  const at = (s: number) => {
    const g = f.shape(s, minFeature)
    const { qc, qd } = f.flows(g, liquids)
    return {
      g,
      qc,
      qd,
      forecast: forecastAt({ ...liquids, kind: f.kind, ...g, flowContinuous: qc, flowDispersed: qd }, qc, qd),
    }
  }
  const s = bisectLog(x => at(x).forecast.dropletDiameter.value, 0.5e-6, 5e-3, target.diameter, 50)
  if (s === null) return null
  const raw = f.shape(s, minFeature)
  const g = {
    mainWidth: roundLength(raw.mainWidth),
    inletWidth: roundLength(raw.inletWidth),
    depth: roundLength(raw.depth),
  }
  const { qc, qd } = f.flows(g, liquids)
  const forecast = forecastAt({ ...liquids, kind: f.kind, ...g, flowContinuous: qc, flowDispersed: qd }, qc, qd)
  const perJunction = forecast.frequency.value
  const count = target.minFrequency === undefined ? 1 : Math.max(1, Math.ceil(target.minFrequency / perJunction))
  const pitch =
    f.kind === 'step' ? roundLength(Math.max(2 * g.mainWidth, g.mainWidth + process.minGap * 1e-6)) : undefined
  const problems = processProblems(f.kind, g, pitch, process)
  const lawValid = forecast.dropletDiameter.valid && forecast.frequency.valid
  const m = (method: string, source: string): Method => ({ id: method, source })
  const law = m(forecast.dropletDiameter.method, forecast.dropletDiameter.source)
  const suggestion: GeometrySuggestion = {
    kind: f.kind,
    junction: {
      mainWidth: quantity(g.mainWidth, UNIT.length, GEOMETRY_FAMILY, lawValid),
      inletWidth: quantity(g.inletWidth, UNIT.length, GEOMETRY_FAMILY, lawValid),
      depth: quantity(g.depth, UNIT.length, GEOMETRY_FAMILY, lawValid),
    },
    count,
    flow: { continuous: quantity(qc, UNIT.flow, GEOMETRY_FAMILY), dispersed: quantity(qd, UNIT.flow, GEOMETRY_FAMILY) },
    expected: {
      dropletDiameter: forecast.dropletDiameter,
      frequency: forecast.frequency,
      totalFrequency: quantity(perJunction * count, UNIT.frequency, law, forecast.frequency.valid),
      capillaryNumber: forecast.capillaryNumber,
      regime: forecast.regime.value,
    },
    law: { method: law.id, source: law.source },
    validity: f.validity,
    reason:
      `${f.why}${count > 1 ? `; ${count} ${f.kind === 'step' ? 'nozzles' : 'junctions'} in parallel give ≥ the wanted rate at ${perJunction.toPrecision(3)} Hz each` : ''}` +
      (lawValid
        ? ''
        : `; the size law is outside its validity here (${forecast.warnings.map(w => w.code).join(', ') || 'see the forecast'}), so the size is an estimate`),
    process: { id: process.id, name: process.name, ok: problems.length === 0, problems },
    valid: lawValid && problems.length === 0,
  }
  if (pitch !== undefined) suggestion.pitch = quantity(pitch, UNIT.length, GEOMETRY_FAMILY)
  return suggestion
}

/** One suggestion per junction kind (those whose law can reach the target at all). */
export function suggestGeometries(
  liquids: Liquids,
  target: PlanTarget,
  process: FabricationProcess,
  kinds: JunctionKind[] = ['t-junction', 'flow-focusing', 'step'],
): GeometrySuggestion[] {
  return FAMILIES.filter(f => kinds.includes(f.kind))
    .map(f => suggest(f, liquids, target, process))
    .filter((s): s is GeometrySuggestion => s !== null)
}
