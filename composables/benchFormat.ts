import { displayUnitName, formatNumber, formatPercent, formatPressureMbar } from '#shared/format/quantity'
import type { BenchConditions } from '#shared/schemas/bench'
import type { BenchPrediction } from '#shared/types/bench'

// Display helpers for bench results: numbers with their units, and the labels of sources, regimes and kinds.
export const BENCH_SOURCE_LABELS: Record<string, string> = {
  typed: 'Typed',
  csv: 'CSV import',
  micrograph: 'Micrograph',
}
export const REGIME_COLOURS: Record<string, string> = {
  squeezing: '#1f6f8b',
  transition: '#c47f0e',
  dripping: '#2f8a57',
  jetting: '#b3372b',
  'step-emulsification': '#3e4a56',
}

/** The chip a run's forecast ran on, in a few words ("" for runs recorded before this was kept). */
export function chipLabel(chip: BenchPrediction['chip'] | undefined): string {
  if (!chip) return ''
  const base = chip.basis === 'as-built' ? 'Chip as built' : 'Chip as drawn'
  return chip.benchSizes ? `${base}, sizes measured at the bench` : base
}

/**
 * What was set at the bench for a run, in a few words with units ("Qc 10 µL/min · Qd 2 µL/min · 24 °C"), or ""
 * when the run kept the design's operating point. Numbers as typed (input precision).
 */
export function conditionsLabel(conditions: Partial<BenchConditions> | Record<string, unknown> | null | undefined) {
  const c = (conditions ?? {}) as Partial<BenchConditions>
  const typed = (v: number) => formatNumber(v, 6)
  const parts: string[] = []
  if (c.continuousFlow) parts.push(`Qc ${typed(c.continuousFlow.value)} ${displayUnitName(c.continuousFlow.unit)}`)
  if (c.continuousPressureMbar !== undefined) parts.push(`Pc ${formatPressureMbar(c.continuousPressureMbar, 'input')}`)
  if (c.dispersedFlow) parts.push(`Qd ${typed(c.dispersedFlow.value)} ${displayUnitName(c.dispersedFlow.unit)}`)
  if (c.dispersedPressureMbar !== undefined) parts.push(`Pd ${formatPressureMbar(c.dispersedPressureMbar, 'input')}`)
  if (c.temperatureC !== undefined) parts.push(`${typed(c.temperatureC)} °C`)
  const liquids = [c.continuousLiquid, c.dispersedLiquid].filter(Boolean).join(' / ')
  if (liquids) parts.push(liquids)
  if (c.surfactant) parts.push(c.surfactant)
  return parts.join(' · ')
}

/** A number to `digits` significant figures, grouped for reading; a dash when missing. */
export function sig(value: number | null | undefined, digits = 3): string {
  return value == null || !Number.isFinite(value) ? '—' : formatNumber(value, digits)
}

export function percent(value: number | null | undefined, digits = 1): string {
  return value == null || !Number.isFinite(value) ? '—' : formatPercent(value, digits + 2)
}

/** Nice axis ticks from 0 to above `max`. */
export function axisTicks(max: number, count = 5): number[] {
  if (!(max > 0)) return [0, 1]
  const raw = max / count
  const magnitude = 10 ** Math.floor(Math.log10(raw))
  const step = [1, 2, 2.5, 5, 10].map(f => f * magnitude).find(s => s >= raw) ?? raw
  return Array.from({ length: Math.ceil(max / step) + 1 }, (_, i) => +(i * step).toPrecision(6))
}
