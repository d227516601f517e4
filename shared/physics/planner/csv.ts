// CSV export of a window (or any sweep of points): one row per point, lab units in the header.
import type { PlanWindow, WindowPoint } from './types'

const cell = (v: number | string | boolean | undefined): string => {
  if (v === undefined) return ''
  const s = typeof v === 'number' ? (Number.isFinite(v) ? String(+v.toPrecision(6)) : '') : String(v)
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
}

const HEADER = [
  'continuous_flow_uL_min',
  'dispersed_flow_uL_min',
  'continuous_pressure_mbar',
  'dispersed_pressure_mbar',
  'droplet_diameter_um',
  'frequency_Hz',
  'regime',
  'valid',
  'within_limits',
  'hits_target',
  'size_method',
]

export function pointRow(p: WindowPoint): string {
  return [
    p.flow.continuous.value * 6e10,
    p.flow.dispersed.value * 6e10,
    p.pressure?.continuous.valid ? p.pressure.continuous.value / 100 : undefined,
    p.pressure?.dispersed.valid ? p.pressure.dispersed.value / 100 : undefined,
    p.dropletDiameter ? p.dropletDiameter.value * 1e6 : undefined,
    p.frequency?.value,
    p.regime,
    p.valid,
    p.withinLimits,
    p.hit,
    p.dropletDiameter?.method,
  ]
    .map(cell)
    .join(',')
}

/** The window as CSV (RFC 4180 quoting), header first. */
export function windowCsv(window: Pick<PlanWindow, 'points'>): string {
  return [HEADER.join(','), ...window.points.map(pointRow)].join('\n') + '\n'
}
