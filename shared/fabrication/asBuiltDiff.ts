// What changed between the forecast on the drawn chip and on the as-built chip, and which changes are larger than
// the forecast method can tell apart. Pure: compares two revision summaries (forecast + rule findings).
import type { RevisionSummary } from '../types/designs'

/**
 * Relative scatter of each method's droplet diameter for one chip (how far two forecasts must differ before the
 * difference means something). Common practice, no source: the spread of repeated runs on one device is a few
 * per cent for step emulsification and wider for shear-driven junctions; a lab calibration narrows it.
 */
export const DIAMETER_UNCERTAINTY: Record<string, number> = {
  'step-nozzle': 0.1, 'step-array': 0.1, 't-junction': 0.15, 'flow-focusing': 0.2, 'y-junction': 0.2,
}
/** Inlet pressures follow the hydraulic resistance (∝ 1/(w h³) for a shallow channel): ±10 %, common practice, no source. */
export const PRESSURE_UNCERTAINTY = 0.1
const FALLBACK_UNCERTAINTY = 0.2

export interface AsBuiltChange {
  what: 'droplet-diameter' | 'inlet-pressure' | 'findings'
  /** Junction or port id, or the findings' severity. */
  id: string
  label: string
  designed: number | null
  asBuilt: number | null
  unit: string
  /** (as-built − designed) / designed; null when either is missing. */
  relative: number | null
  uncertainty: number | null
  exceeds: boolean
}

const rel = (a: number | null, b: number | null) => (a !== null && b !== null && a !== 0 ? (b - a) / a : null)

export function asBuiltChanges(designed: RevisionSummary, asBuilt: RevisionSummary): AsBuiltChange[] {
  const out: AsBuiltChange[] = []
  const op = designed.operatingPoint ?? 'the active operating point'
  for (const j of designed.junctions) {
    const b = asBuilt.junctions.find(x => x.id === j.id)
    const r = rel(j.dropletDiameterUm, b?.dropletDiameterUm ?? null)
    const u = DIAMETER_UNCERTAINTY[j.kind] ?? FALLBACK_UNCERTAINTY
    out.push({ what: 'droplet-diameter', id: j.id, label: `Droplet diameter at ${j.id} (${op})`, designed: j.dropletDiameterUm, asBuilt: b?.dropletDiameterUm ?? null, unit: 'µm', relative: r, uncertainty: u, exceeds: r !== null && Math.abs(r) > u })
  }
  for (const i of designed.inlets) {
    const b = asBuilt.inlets.find(x => x.portId === i.portId)
    const r = rel(i.pressureMbar, b?.pressureMbar ?? null)
    out.push({ what: 'inlet-pressure', id: i.portId, label: `Inlet pressure at ${i.portId} (${op})`, designed: i.pressureMbar, asBuilt: b?.pressureMbar ?? null, unit: 'mbar', relative: r, uncertainty: PRESSURE_UNCERTAINTY, exceeds: r !== null && Math.abs(r) > PRESSURE_UNCERTAINTY })
  }
  for (const severity of ['errors', 'warnings'] as const) {
    const a = designed.findings[severity]
    const b = asBuilt.findings[severity]
    // Any new rule error is worth a warning: the as-built chip breaks a rule the drawing kept.
    out.push({ what: 'findings', id: severity, label: `Design-rule ${severity}`, designed: a, asBuilt: b, unit: '', relative: rel(a, b), uncertainty: null, exceeds: severity === 'errors' && b > a })
  }
  return out
}

/** One line per change in words, for the e-mail and the page: "Droplet diameter at sn-1 (op-1): 40 → 48 µm (+20 %)". */
export function describeChange(c: AsBuiltChange): string {
  const fmt = (v: number | null) => (v === null ? 'none' : String(Number(v.toPrecision(3))))
  const pct = c.relative === null ? '' : ` (${c.relative >= 0 ? '+' : '−'}${Math.abs(c.relative * 100).toFixed(0)} %)`
  return `${c.label}: ${fmt(c.designed)} → ${fmt(c.asBuilt)}${c.unit ? ` ${c.unit}` : ''}${pct}${c.exceeds ? ' — beyond the method\'s uncertainty' : ''}`
}
