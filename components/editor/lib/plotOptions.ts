// ECharts options for the forecast plots of one junction, built from the sweeps in shared/editor/sweep.ts. Pure:
// the same numbers give the same option, so a test can read what a plot will show without a browser.
import type { EChartsOption, TooltipComponentFormatterCallbackParams } from 'echarts'
import type { RegimeCell, SweepPoint } from '#shared/editor/sweep'
import { formatNumber } from '#shared/format/quantity'

/** Dropwright's palette (tailwind.config.ts) for the plots. */
export const PLOT_COLOURS = {
  line: '#1f6f8b',
  current: '#de9a25',
  outside: '#b86e00',
  ink: '#3e4a56',
  grid: '#d3dae0',
  frame: '#b0bcc6',
  regimes: {
    squeezing: '#a9d2e1',
    transition: '#f2d28a',
    dripping: '#3f90b0',
    jetting: '#b3372b',
    'step-emulsification': '#74b4cc',
  } as Record<string, string>,
}

const FONT = { fontFamily: 'JetBrains Mono, ui-monospace, monospace', fontSize: 10, color: PLOT_COLOURS.ink }
/** A tooltip formatter from the point's (x, y). */
const tipOf = (f: (x: number, y: number) => string) => (p: TooltipComponentFormatterCallbackParams) => {
  const v = (Array.isArray(p) ? p[0] : p)?.value as number[]
  return f(v[0]!, v[1]!)
}
/** Axis and tooltip numbers through the one formatting module (shared/format/quantity.ts). */
const sig = (v: number) => formatNumber(v, 3)

function logAxis(name: string, gap: number, ends = false) {
  return {
    type: 'log' as const,
    name,
    nameLocation: 'middle' as const,
    nameGap: gap,
    logBase: 10,
    // Hug the data (a flat curve over three empty decades reads as "nothing changes").
    min: (v: { min: number }) => v.min / 1.3,
    max: (v: { max: number }) => v.max * 1.3,
    nameTextStyle: { ...FONT, fontFamily: 'IBM Plex Sans, system-ui, sans-serif', fontSize: 11 },
    axisLabel: {
      ...FONT,
      formatter: (v: number) => (ends ? formatNumber(v, 2) : sig(v)),
      showMinLabel: ends,
      showMaxLabel: ends,
    },
    axisLine: { lineStyle: { color: PLOT_COLOURS.frame } },
    splitLine: { lineStyle: { color: PLOT_COLOURS.grid } },
    minorTick: { show: false },
  }
}

/** Diameter axis: linear while the sizes stay within a decade (a log axis would show one tick), log beyond. */
function diameterAxis(values: number[]) {
  const v = values.filter(x => x > 0 && Number.isFinite(x))
  const log = v.length > 0 && Math.max(...v) / Math.min(...v) > 10
  // Labels at both ends too: a log axis within one decade has no decade tick, and a y axis without numbers reads as nothing.
  const axis = logAxis('droplet diameter Ø, µm', 40, true)
  return log
    ? axis
    : {
        ...axis,
        type: 'value' as const,
        logBase: undefined,
        scale: true,
        min: undefined,
        max: undefined,
        splitNumber: 4,
      }
}

/** A legend over the plot naming each marker (the operating point above all). */
const LEGEND = (data: string[]) => ({
  top: 0,
  left: 'center',
  itemWidth: 10,
  itemHeight: 10,
  textStyle: { ...FONT, fontFamily: 'IBM Plex Sans, system-ui, sans-serif', fontSize: 11 },
  data,
})

const base = (): EChartsOption => ({
  animation: false,
  textStyle: FONT,
  grid: { left: 52, right: 12, top: 26, bottom: 42 },
  tooltip: { trigger: 'item', confine: true, textStyle: { ...FONT, fontSize: 11 } },
})

export interface SizePlotInput {
  points: SweepPoint[]
  current: { x: number; diameterUm: number }
  xName: string
  xSymbol: string
}

/** Droplet diameter (µm) against a swept quantity (log); points outside a method's validity in amber; the current point marked. */
export function sizePlotOption({ points, current, xName, xSymbol }: SizePlotInput): EChartsOption {
  const tip = (x: number, d: number) => `${xSymbol} = ${sig(x)}<br>Ø ${sig(d)} µm`
  return {
    ...base(),
    legend: LEGEND(['forecast', 'outside validity', 'operating point']),
    xAxis: logAxis(xName, 26),
    yAxis: diameterAxis(points.map(p => p.diameterUm).concat(current.diameterUm)),
    series: [
      {
        name: 'forecast',
        type: 'line',
        showSymbol: false,
        data: points.map(p => [p.x, p.diameterUm]),
        lineStyle: { color: PLOT_COLOURS.line, width: 1.8 },
        itemStyle: { color: PLOT_COLOURS.line },
        tooltip: { formatter: tipOf((x, y) => tip(x, y)) },
      },
      {
        name: 'outside validity',
        type: 'scatter',
        symbolSize: 5,
        data: points.filter(p => !p.valid).map(p => [p.x, p.diameterUm]),
        itemStyle: { color: PLOT_COLOURS.outside },
        tooltip: { formatter: tipOf((x, y) => `${tip(x, y)}<br>outside the method's validity`) },
      },
      {
        name: 'operating point',
        type: 'scatter',
        symbolSize: 10,
        z: 5,
        data: [[current.x, current.diameterUm]],
        itemStyle: { color: PLOT_COLOURS.current, borderColor: '#0f1317', borderWidth: 1.5 },
        tooltip: { formatter: tipOf((x, y) => `operating point<br>${tip(x, y)}`) },
      },
    ],
  }
}

export interface RegimeMapInput {
  cells: RegimeCell[]
  current: { ca: number; phi: number }
}

/** Breakup regime over capillary number × flow-rate ratio (both log), one series per regime, the current point ringed. */
export function regimeMapOption({ cells, current }: RegimeMapInput): EChartsOption {
  const regimes = [...new Set(cells.map(c => c.regime))]
  return {
    ...base(),
    grid: { left: 48, right: 12, top: 30, bottom: 42 },
    legend: LEGEND([...regimes, 'operating point']),
    xAxis: logAxis('capillary number Ca (dimensionless)', 26, true),
    yAxis: logAxis('flow-rate ratio Qd/Qc (dimensionless)', 40, true),
    series: [
      ...regimes.map(r => ({
        name: r,
        type: 'scatter' as const,
        symbol: 'rect',
        symbolSize: Math.max(5, Math.round(150 / Math.sqrt(Math.max(1, cells.length)))),
        data: cells.filter(c => c.regime === r).map(c => [c.ca, c.phi]),
        itemStyle: { color: PLOT_COLOURS.regimes[r] ?? PLOT_COLOURS.frame, opacity: 0.9 },
        tooltip: { formatter: tipOf((x, y) => `${r}<br>Ca = ${sig(x)}<br>Qd/Qc = ${sig(y)}`) },
      })),
      {
        name: 'operating point',
        type: 'scatter' as const,
        symbol: 'circle',
        symbolSize: 13,
        z: 5,
        data: [[current.ca, current.phi]],
        itemStyle: { color: 'rgba(0,0,0,0)', borderColor: '#0f1317', borderWidth: 2.5 },
        tooltip: { formatter: tipOf((x, y) => `operating point<br>Ca = ${sig(x)}<br>Qd/Qc = ${sig(y)}`) },
      },
    ],
  }
}

export const shortNumber = sig
