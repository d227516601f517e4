// ECharts options for the planner's plots: the operating window as a map (regime bands, the points that hit the
// target, the target-size and minimum-rate lines, the recommended point), occupancy bars and digital precision.
// Pure: the same answer gives the same option.
import type { EChartsOption } from 'echarts'
import type { DigitalAssay, Encapsulation, PlanWindow, Recommended, WindowPoint } from '#shared/physics/planner'
import { formatLengthUm, formatNumber, formatRateHz } from '#shared/format/quantity'
import { PLOT_COLOURS } from '~~/components/editor/lib/plotOptions'

const FONT = { fontFamily: 'JetBrains Mono, ui-monospace, monospace', fontSize: 10, color: PLOT_COLOURS.ink }
const NAME_FONT = { ...FONT, fontFamily: 'IBM Plex Sans, system-ui, sans-serif', fontSize: 11 }
/** Numbers through the one formatting module (shared/format/quantity.ts). */
const sig = (v: number) => formatNumber(v, 3)

/** Axis value in lab units: flows in µL/min, pressures in mbar. */
export function axisInLabUnits(mode: 'flow' | 'pressure', si: number): number {
  return mode === 'flow' ? si * 6e10 : si / 100
}
const axisName = (phase: string, mode: 'flow' | 'pressure') =>
  `${phase} ${mode === 'flow' ? 'flow, µL/min' : 'inlet pressure, mbar'}`

function axis(name: string, mode: 'flow' | 'pressure', gap: number, values: number[]) {
  const lo = axisInLabUnits(mode, values[0]!)
  const hi = axisInLabUnits(mode, values.at(-1)!)
  const pad = mode === 'flow' ? [lo / 1.25, hi * 1.25] : [lo - (hi - lo) * 0.04, hi + (hi - lo) * 0.04]
  return {
    type: mode === 'flow' ? ('log' as const) : ('value' as const),
    name,
    nameLocation: 'middle' as const,
    nameGap: gap,
    min: pad[0],
    max: pad[1],
    nameTextStyle: NAME_FONT,
    axisLabel: { ...FONT, formatter: (v: number) => sig(v), showMinLabel: false, showMaxLabel: false },
    axisLine: { lineStyle: { color: PLOT_COLOURS.frame } },
    splitLine: { lineStyle: { color: PLOT_COLOURS.grid } },
  }
}

/** Axis values (lab units) of a window point. */
export function pointAxes(window: PlanWindow, p: WindowPoint): [number, number] {
  const x = window.mode.continuous === 'pressure' ? p.pressure!.continuous.value : p.flow.continuous.value
  const y = window.mode.dispersed === 'pressure' ? p.pressure!.dispersed.value : p.flow.dispersed.value
  return [axisInLabUnits(window.mode.continuous, x), axisInLabUnits(window.mode.dispersed, y)]
}

export function windowMapOption(window: PlanWindow, recommended: Recommended | null): EChartsOption {
  const regimes = [...new Set(window.points.map(p => p.regime))]
  const tip = (p: WindowPoint) => {
    const [x, y] = pointAxes(window, p)
    const d = p.dropletDiameter
      ? `Ø ${formatLengthUm(p.dropletDiameter.value * 1e6)}, ${formatRateHz(p.frequency!.value)}`
      : 'no drops'
    return `${axisName('continuous', window.mode.continuous)} ${sig(x)}<br>${axisName('dispersed', window.mode.dispersed)} ${sig(y)}<br>${d}<br>${p.regime}${p.valid ? '' : ' · outside validity'}${p.withinLimits ? '' : ' · above a pressure limit'}`
  }
  // Series are built as plain objects (the data items carry their tooltip text), typed once at the end.
  const series: Record<string, unknown>[] = regimes.map(regime => ({
    name: regime === 'none' ? 'no drops' : regime,
    type: 'scatter' as const,
    symbol: 'rect',
    symbolSize: 7,
    data: window.points
      .filter(p => p.regime === regime)
      .map(p => ({ value: pointAxes(window, p), itemStyle: { opacity: p.valid ? 0.9 : 0.35 }, tip: tip(p) })),
    itemStyle: { color: PLOT_COLOURS.regimes[regime] ?? '#c7ced4' },
    tooltip: { formatter: (q: any) => q.data.tip },
  }))
  series.push({
    name: 'hits the target',
    type: 'scatter',
    symbol: 'circle',
    symbolSize: 6,
    z: 3,
    data: window.points.filter(p => p.hit).map(p => ({ value: pointAxes(window, p), tip: tip(p) })),
    itemStyle: { color: 'transparent', borderColor: '#0f1317', borderWidth: 1.2 },
    tooltip: { formatter: (q: any) => q.data.tip },
  })
  const label = (v: number, x: number) => axisInLabUnits(x === 0 ? window.mode.continuous : window.mode.dispersed, v)
  for (const c of window.contours) {
    if (c.name === 'diameter-low' || c.name === 'diameter-high' || c.points.length < 2) continue
    const name =
      c.name === 'target-diameter'
        ? `target Ø ${formatLengthUm(c.level.value * 1e6)}`
        : `minimum rate ${formatRateHz(c.level.value)}`
    series.push({
      name,
      type: 'line',
      showSymbol: false,
      z: 4,
      data: c.points.map(([x, y]) => [label(x, 0), label(y, 1)]),
      lineStyle: {
        color: c.name === 'target-diameter' ? PLOT_COLOURS.line : PLOT_COLOURS.outside,
        width: 1.8,
        type: c.name === 'target-diameter' ? 'solid' : 'dashed',
      },
      itemStyle: { color: c.name === 'target-diameter' ? PLOT_COLOURS.line : PLOT_COLOURS.outside },
    })
  }
  if (recommended) {
    series.push({
      name: 'recommended point',
      type: 'scatter',
      symbol: 'pin',
      symbolSize: 18,
      z: 6,
      data: [{ value: pointAxes(window, recommended), tip: `recommended<br>${tip(recommended)}` }],
      itemStyle: { color: PLOT_COLOURS.current, borderColor: '#0f1317', borderWidth: 1 },
      tooltip: { formatter: (q: any) => q.data.tip },
    })
  }
  return {
    animation: false,
    textStyle: FONT,
    grid: { left: 52, right: 10, top: 64, bottom: 42 },
    legend: { top: 0, left: 0, textStyle: { ...FONT, fontSize: 10 }, itemWidth: 12, itemHeight: 8, itemGap: 6 },
    tooltip: { trigger: 'item', confine: true, textStyle: { ...FONT, fontSize: 11 } },
    xAxis: axis(
      axisName('continuous', window.mode.continuous),
      window.mode.continuous,
      26,
      window.axes.continuous.values,
    ),
    yAxis: axis(axisName('dispersed', window.mode.dispersed), window.mode.dispersed, 40, window.axes.dispersed.values),
    series: series as EChartsOption['series'],
  }
}

/** Occupancy bars: percentage of drops holding k cells, k = 0…5, each labelled (small shares stay readable). */
export function occupancyOption(e: Encapsulation): EChartsOption {
  const pct = (p: number) => formatNumber(p * 100, p * 100 >= 0.1 ? 3 : 2)
  return {
    animation: false,
    textStyle: FONT,
    grid: { left: 44, right: 8, top: 18, bottom: 38 },
    tooltip: {
      trigger: 'item',
      confine: true,
      formatter: (q: any) => `${q.name} cells per drop: ${pct(q.value / 100)} %`,
    },
    xAxis: {
      type: 'category',
      name: 'cells per drop',
      nameLocation: 'middle',
      nameGap: 24,
      nameTextStyle: NAME_FONT,
      data: e.distribution.map(d => String(d.k)),
      axisLabel: FONT,
    },
    yAxis: {
      type: 'value',
      name: 'drops, %',
      nameLocation: 'middle',
      nameGap: 30,
      nameTextStyle: NAME_FONT,
      min: 0,
      max: 100,
      axisLabel: FONT,
      splitLine: { lineStyle: { color: PLOT_COLOURS.grid } },
    },
    series: [
      {
        name: 'Poisson share',
        type: 'bar',
        data: e.distribution.map(d => d.probability.value * 100),
        itemStyle: { color: PLOT_COLOURS.line },
        label: { show: true, position: 'top', ...FONT, formatter: (q: any) => `${pct(q.value / 100)}` },
      },
    ],
  }
}

/** Relative half-width of the concentration interval against concentration (copies/µL). */
export function precisionOption(d: DigitalAssay): EChartsOption {
  return {
    animation: false,
    textStyle: FONT,
    grid: { left: 48, right: 8, top: 10, bottom: 40 },
    tooltip: { trigger: 'item', confine: true },
    xAxis: {
      type: 'log',
      name: 'concentration, copies/µL',
      nameLocation: 'middle',
      nameGap: 26,
      nameTextStyle: NAME_FONT,
      axisLabel: { ...FONT, formatter: (v: number) => sig(v) },
      splitLine: { lineStyle: { color: PLOT_COLOURS.grid } },
    },
    yAxis: {
      type: 'log',
      name: '± %, 95 % interval',
      nameLocation: 'middle',
      nameGap: 34,
      nameTextStyle: NAME_FONT,
      axisLabel: { ...FONT, formatter: (v: number) => sig(v) },
      splitLine: { lineStyle: { color: PLOT_COLOURS.grid } },
    },
    series: [
      {
        name: 'precision',
        type: 'line',
        showSymbol: false,
        data: d.precision.map(p => [p.concentration.value * 1e-9, p.relativeHalfWidth.value * 100]),
        lineStyle: { color: PLOT_COLOURS.line, width: 1.8 },
      },
    ],
  }
}

/** A CSV download of the window. */
export function downloadCsv(text: string, name: string): void {
  const a = document.createElement('a')
  a.href = URL.createObjectURL(new Blob([text], { type: 'text/csv' }))
  a.download = name
  a.click()
  URL.revokeObjectURL(a.href)
}
