// What changed between the forecast on the drawn chip and on the as-built chip, and which changes are larger than
// the forecast method can tell apart. Pure: compares two revision summaries (forecast + rule findings).
import { junctionName as nameJunction } from '../format/fieldLabels'
import { formatLengthUm, formatPercent, formatPlain, formatPressureMbar } from '../format/quantity'
import type { RevisionSummary } from '../types/designs'
import { counted } from '../utils/counted'

/**
 * Relative scatter of each method's droplet diameter for one chip (how far two forecasts must differ before the
 * difference means something). Common practice, no source: the spread of repeated runs on one device is a few
 * per cent for step emulsification and wider for shear-driven junctions; a lab calibration narrows it.
 */
export const DIAMETER_UNCERTAINTY: Record<string, number> = {
  'step-nozzle': 0.1,
  'step-array': 0.1,
  't-junction': 0.15,
  'flow-focusing': 0.2,
  'y-junction': 0.2,
}
/** Inlet pressures follow the hydraulic resistance (∝ 1/(w h³) for a shallow channel): ±10 %, common practice, no source. */
export const PRESSURE_UNCERTAINTY = 0.1
const FALLBACK_UNCERTAINTY = 0.2

export interface AsBuiltChange {
  what: 'droplet-diameter' | 'inlet-pressure' | 'findings'
  /** Junction or port id, or the findings' severity (the API keeps ids; `label` is for people). */
  id: string
  /** In people's words, with the element's and the operating point's names: `Droplet diameter at T-junction “tj-1”, operating point “Cells in 40 µm drops”`. */
  label: string
  designed: number | null
  asBuilt: number | null
  /** 'µm', 'mbar', or '' for a count of findings. */
  unit: string
  /** (as-built − designed) / designed for a quantity; null for a count, or when either is missing. */
  relative: number | null
  uncertainty: number | null
  exceeds: boolean
}

/** The designed chip's elements, to name them (any chip document). */
type NamingDoc = { operatingPoints?: ReadonlyArray<{ id: string; name?: string }> } & object

const rel = (a: number | null, b: number | null) => (a !== null && b !== null && a !== 0 ? (b - a) / a : null)
const junctionName = (doc: NamingDoc | undefined, id: string) => nameJunction(doc as never, id)

/** "operating point “Cells in 40 µm drops”" (its own name; the id when the document has none). */
function operatingPointName(doc: NamingDoc | undefined, id: string | null): string {
  if (!id) return 'the active operating point'
  const name = doc?.operatingPoints?.find(o => o.id === id)?.name?.trim()
  return `operating point “${name || id}”`
}

/**
 * The changes from the drawn chip's summary to the as-built chip's. `doc`: the drawn chip, to name junctions and
 * the operating point in the labels (without it the labels quote ids).
 */
export function asBuiltChanges(designed: RevisionSummary, asBuilt: RevisionSummary, doc?: NamingDoc): AsBuiltChange[] {
  const out: AsBuiltChange[] = []
  const op = operatingPointName(doc, designed.operatingPoint)
  for (const j of designed.junctions) {
    const b = asBuilt.junctions.find(x => x.id === j.id)
    const r = rel(j.dropletDiameterUm, b?.dropletDiameterUm ?? null)
    const u = DIAMETER_UNCERTAINTY[j.kind] ?? FALLBACK_UNCERTAINTY
    out.push({
      what: 'droplet-diameter',
      id: j.id,
      label: `Droplet diameter at ${junctionName(doc, j.id)}, ${op}`,
      designed: j.dropletDiameterUm,
      asBuilt: b?.dropletDiameterUm ?? null,
      unit: 'µm',
      relative: r,
      uncertainty: u,
      exceeds: r !== null && Math.abs(r) > u,
    })
  }
  for (const i of designed.inlets) {
    const b = asBuilt.inlets.find(x => x.portId === i.portId)
    const r = rel(i.pressureMbar, b?.pressureMbar ?? null)
    out.push({
      what: 'inlet-pressure',
      id: i.portId,
      label: `Pressure at inlet “${i.portId}”, ${op}`,
      designed: i.pressureMbar,
      asBuilt: b?.pressureMbar ?? null,
      unit: 'mbar',
      relative: r,
      uncertainty: PRESSURE_UNCERTAINTY,
      exceeds: r !== null && Math.abs(r) > PRESSURE_UNCERTAINTY,
    })
  }
  for (const severity of ['errors', 'warnings'] as const) {
    const a = designed.findings[severity]
    const b = asBuilt.findings[severity]
    // Any new rule error is worth a warning: the as-built chip breaks a rule the drawing kept.
    out.push({
      what: 'findings',
      id: severity,
      label: `Design-rule ${severity}`,
      designed: a,
      asBuilt: b,
      unit: '',
      relative: null,
      uncertainty: null,
      exceeds: severity === 'errors' && b > a,
    })
  }
  return out
}

const NOUNS = { errors: ['error', 'errors'], warnings: ['warning', 'warnings'] } as const

/** A value of a change through shared/format: µm with its prefix, mbar, or a plain count. */
function shown(v: number | null, unit: string): string {
  if (v === null) return 'no forecast'
  return unit === 'µm' ? formatLengthUm(v) : unit === 'mbar' ? formatPressureMbar(v) : formatPlain(v)
}

/** A relative change with its sign: "+20 %", "−15 %" (two significant figures). */
export const signedPercent = (fraction: number): string => `${fraction >= 0 ? '+' : ''}${formatPercent(fraction, 2)}`

/**
 * One line per change in words, for the e-mail and the page, every number through shared/format:
 * "Droplet diameter at Step nozzle “sn-1”, operating point “Day 1”: 40 → 48 µm (+20 %) — beyond the method's
 * uncertainty"; a count says what it counts and no percentage: "Design rules: 1 → 3 warnings".
 */
export function describeChange(c: AsBuiltChange): string {
  if (c.what === 'findings') {
    const [one, many] = NOUNS[c.id as keyof typeof NOUNS] ?? ['finding', 'findings']
    const counts = `${c.designed ?? 0} → ${counted(c.asBuilt ?? 0, one, many)}`
    return `Design rules: ${counts}${c.exceeds ? ' — the as-built chip breaks a rule the drawing kept' : ''}`
  }
  let from = shown(c.designed, c.unit)
  const to = shown(c.asBuilt, c.unit)
  // "40 → 48 µm": the unit once when both sides share it.
  const unit = / [^\d\s]+$/.exec(to)?.[0]
  if (unit && from.endsWith(unit)) from = from.slice(0, -unit.length)
  const pct = c.relative === null ? '' : ` (${signedPercent(c.relative)})`
  return `${c.label}: ${from} → ${to}${pct}${c.exceeds ? " — beyond the method's uncertainty" : ''}`
}
