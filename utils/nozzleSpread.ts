// The spread across the nozzles of an array (a step-emulsifier ladder: ids "arr-1[0]" … "arr-1[255]"): per nozzle its
// droplet diameter, rate and dispersed flow, and for each the min, max, mean and coefficient of variation, the way a
// reviewer asks "are all nozzles making the same drops?". Pure: a test reads it without a browser.
import Papa from 'papaparse'
import type { EChartsOption } from 'echarts'
import { formatNumber } from '#shared/format/quantity'
import { PLOT_COLOURS } from '~~/components/editor/lib/plotOptions'

export interface NozzleInput {
  id: string
  kind: string
  dropletDiameterUm: number | null
  frequencyHz: number | null
  valid: boolean
  flowUlPerMin?: number | null
}
export interface NozzleRow extends NozzleInput {
  array: string
  nozzle: number
  flowUlPerMin: number | null
}
export interface Spread {
  count: number
  min: number
  max: number
  mean: number
  cv: number
}
export interface NozzleGroup {
  /** The array element's id, or `bank:<kind>` for separate junctions of one kind placed as a bank. */
  array: string
  kind: string
  bank: boolean
  rows: NozzleRow[]
  diameter: Spread | null
  flow: Spread | null
  rate: Spread | null
}

const NOZZLE_ID = /^(.*)\[(\d+)\]$/

/**
 * Dispersed flow through a nozzle from its drops: Qd = f · πd³/6 (continuity: every drop carries its volume of
 * dispersed phase; a sphere of diameter d has volume πd³/6). µm³/s → µL/min: 1 µm³ = 1e-9 µL, × 60 s/min.
 */
export function flowFromDrops(diameterUm: number | null, frequencyHz: number | null): number | null {
  if (diameterUm == null || frequencyHz == null) return null
  return ((frequencyHz * Math.PI * diameterUm ** 3) / 6) * 1e-9 * 60
}

/** min, max, mean and CV = s/mean with the sample standard deviation (n − 1); null without values. */
export function spreadOf(values: Array<number | null>): Spread | null {
  const v = values.filter((x): x is number => x != null && Number.isFinite(x))
  if (!v.length) return null
  const mean = v.reduce((a, b) => a + b, 0) / v.length
  const s = v.length > 1 ? Math.sqrt(v.reduce((a, b) => a + (b - mean) ** 2, 0) / (v.length - 1)) : 0
  return { count: v.length, min: Math.min(...v), max: Math.max(...v), mean, cv: mean === 0 ? 0 : s / mean }
}

/** From this many separate junctions of one kind, they are read as a bank (the array tool places them so). */
export const BANK_MIN = 8

/**
 * Junctions grouped by array: the nozzles of one array element ("arr-1[k]", numbered along its manifold), and
 * separate junctions of one kind when there are at least `bankMin` of them (in document order, which is the order
 * the array tool placed them along the manifold). The rest are left out.
 */
export function nozzleGroups(junctions: NozzleInput[], bankMin = BANK_MIN): NozzleGroup[] {
  const byArray = new Map<string, NozzleRow[]>()
  const loose = new Map<string, NozzleInput[]>()
  for (const j of junctions) {
    const m = NOZZLE_ID.exec(j.id)
    if (!m) {
      loose.set(j.kind, [...(loose.get(j.kind) ?? []), j])
      continue
    }
    const row: NozzleRow = {
      ...j,
      array: m[1]!,
      nozzle: Number(m[2]),
      flowUlPerMin: j.flowUlPerMin ?? flowFromDrops(j.dropletDiameterUm, j.frequencyHz),
    }
    byArray.set(row.array, [...(byArray.get(row.array) ?? []), row])
  }
  for (const [kind, list] of loose) {
    if (list.length < bankMin) continue
    byArray.set(
      `bank:${kind}`,
      list.map((j, k) => ({
        ...j,
        array: `bank:${kind}`,
        nozzle: k,
        flowUlPerMin: j.flowUlPerMin ?? flowFromDrops(j.dropletDiameterUm, j.frequencyHz),
      })),
    )
  }
  return [...byArray]
    .filter(([, rows]) => rows.length > 1)
    .map(([array, rows]) => {
      const sorted = rows.sort((a, b) => a.nozzle - b.nozzle)
      return {
        array,
        kind: sorted[0]!.kind,
        bank: array.startsWith('bank:'),
        rows: sorted,
        diameter: spreadOf(sorted.map(r => r.dropletDiameterUm)),
        flow: spreadOf(sorted.map(r => r.flowUlPerMin)),
        rate: spreadOf(sorted.map(r => r.frequencyHz)),
      }
    })
}

export type NozzleSortKey = 'nozzle' | 'dropletDiameterUm' | 'frequencyHz' | 'flowUlPerMin'

/** Rows sorted by one column (missing values last), ascending or descending. */
export function sortNozzles(rows: NozzleRow[], key: NozzleSortKey, dir: 'asc' | 'desc'): NozzleRow[] {
  const sign = dir === 'asc' ? 1 : -1
  return [...rows].sort((a, b) => {
    const x = a[key],
      y = b[key]
    if (x == null && y == null) return a.nozzle - b.nozzle
    if (x == null) return 1
    if (y == null) return -1
    return (x - y) * sign || a.nozzle - b.nozzle
  })
}

/** The table as CSV (papaparse), numbers unrounded, units in the header, nozzles counted from 1 as on screen. */
export function nozzleCsv(group: NozzleGroup): string {
  return Papa.unparse({
    fields: [
      'array',
      'nozzle',
      'droplet_diameter_um',
      'generation_rate_hz',
      'dispersed_flow_ul_per_min',
      'inside_validity',
    ],
    data: group.rows.map(r => [
      group.bank ? r.id : group.array,
      r.nozzle + 1,
      r.dropletDiameterUm ?? '',
      r.frequencyHz ?? '',
      r.flowUlPerMin ?? '',
      r.valid ? 'yes' : 'no',
    ]),
  })
}

const FONT = { fontFamily: 'JetBrains Mono, ui-monospace, monospace', fontSize: 10, color: PLOT_COLOURS.ink }
const NAME_FONT = { ...FONT, fontFamily: 'IBM Plex Sans, system-ui, sans-serif', fontSize: 11 }

/** Diameter (left axis) and dispersed flow (right axis) along the manifold, nozzle 1 … N. */
export function nozzlePlotOption(group: NozzleGroup): EChartsOption {
  const axis = (name: string, position: 'left' | 'right') => ({
    type: 'value' as const,
    name,
    nameLocation: 'middle' as const,
    nameGap: 44,
    position,
    scale: true,
    nameTextStyle: NAME_FONT,
    axisLabel: { ...FONT, formatter: (v: number) => formatNumber(v, 3) },
    splitLine: { show: position === 'left', lineStyle: { color: PLOT_COLOURS.grid } },
  })
  return {
    animation: false,
    textStyle: FONT,
    grid: { left: 58, right: 58, top: 26, bottom: 40 },
    legend: {
      top: 0,
      left: 'center',
      itemWidth: 10,
      itemHeight: 10,
      textStyle: NAME_FONT,
      data: ['droplet diameter', 'dispersed flow'],
    },
    tooltip: { trigger: 'axis', confine: true, textStyle: { ...FONT, fontSize: 11 } },
    xAxis: {
      type: 'value',
      name: 'nozzle along the manifold (1 … N)',
      nameLocation: 'middle',
      nameGap: 24,
      min: 1,
      max: Math.max(2, group.rows.length),
      nameTextStyle: NAME_FONT,
      axisLabel: { ...FONT, formatter: (v: number) => String(v) },
    },
    yAxis: [axis('droplet diameter Ø, µm', 'left'), axis('dispersed flow, µL/min', 'right')],
    series: [
      {
        name: 'droplet diameter',
        type: 'line',
        showSymbol: group.rows.length <= 64,
        symbolSize: 4,
        yAxisIndex: 0,
        data: group.rows.map(r => [r.nozzle + 1, r.dropletDiameterUm]),
        lineStyle: { color: PLOT_COLOURS.line, width: 1.6 },
        itemStyle: { color: PLOT_COLOURS.line },
      },
      {
        name: 'dispersed flow',
        type: 'line',
        showSymbol: group.rows.length <= 64,
        symbolSize: 4,
        yAxisIndex: 1,
        data: group.rows.map(r => [r.nozzle + 1, r.flowUlPerMin]),
        lineStyle: { color: PLOT_COLOURS.current, width: 1.4, type: 'dashed' },
        itemStyle: { color: PLOT_COLOURS.current },
      },
    ],
  }
}
