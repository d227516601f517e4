// The editor's plots as ECharts will draw them: rendered server-side to SVG (ECharts' own SSR mode) so the test
// reads where the operating point lands, with no browser. The numbers come from the same forecast as the editor.
import { describe, expect, it } from 'vitest'
import * as echarts from 'echarts'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import { forecastDocument } from '../../../shared/physics/document'
import { regimeMap, sweepFlowRatio } from '../../../shared/editor/sweep'
import { actions, runAction } from '../../../shared/editor'
import { regimeMapOption, sizePlotOption } from '../../../components/editor/lib/plotOptions'
import { fixtureDocument } from '../../support/factory'

const doc = (): ChipDocument => {
  const r = parseChipDocument(fixtureDocument())
  if (!r.ok) throw new Error('fixture')
  return r.document
}
const junction = (d: ChipDocument) => forecastDocument(d).junctions.find(j => j.element === 'tj-1')!.forecast!

function render(option: echarts.EChartsOption) {
  const chart = echarts.init(null, null, { renderer: 'svg', ssr: true, width: 300, height: 190 })
  chart.setOption(option)
  return chart
}
function ratioPlot(d: ChipDocument) {
  const f = junction(d)
  return sizePlotOption({
    points: sweepFlowRatio(f),
    current: { x: f.flowRateRatio.value, diameterUm: f.dropletDiameter.value * 1e6 },
    xName: 'φ',
    xSymbol: 'φ',
  })
}

describe('forecast plots (ECharts)', () => {
  it('draws the sweep as a line and marks the operating point inside the plot area', () => {
    const chart = render(ratioPlot(doc()))
    const svg = chart.renderToSVGString()
    expect(svg).toMatch(/<svg[^>]+width="300"/)
    expect(svg).toContain('<path')
    const [x, y] = chart.convertToPixel(
      { seriesIndex: 2 },
      (ratioPlot(doc()).series as { data: number[][] }[])[2]!.data[0]!,
    ) as number[]
    expect(x).toBeGreaterThan(48)
    expect(x).toBeLessThan(300 - 12)
    expect(y).toBeGreaterThan(14)
    expect(y).toBeLessThan(190 - 42)
    chart.dispose()
  })

  it('a faster dispersed flow moves the marked point right and up (squeezing: L/w = 1 + α·φ, Garstecki et al. 2006)', () => {
    const before = doc()
    const op = before.operatingPoints[0]!
    const water = op.inlets.find(i => i.portId === 'water-in')!
    const r = runAction(before, actions.setInlet, { opId: op.id, setting: { ...water, value: water.value * 2 } })
    if (!r.ok) throw new Error(r.refusal.message)
    const at = (d: ChipDocument) => {
      const f = junction(d)
      // One fixed frame (the first document's axes) so both points are read on the same scale.
      const chart = render(ratioPlot(before))
      const p = chart.convertToPixel({ seriesIndex: 0 }, [
        f.flowRateRatio.value,
        f.dropletDiameter.value * 1e6,
      ]) as number[]
      chart.dispose()
      return p
    }
    const [x0, y0] = at(before)
    const [x1, y1] = at(r.doc)
    expect(x1! - x0!).toBeGreaterThan(10)
    expect(y1!).toBeLessThan(y0!)
  })

  it('the regime map has one series per regime in the grid, coloured apart, plus the ringed operating point', () => {
    const f = junction(doc())
    const cells = regimeMap(f, 8)
    const option = regimeMapOption({ cells, current: { ca: f.capillaryNumber.value, phi: f.flowRateRatio.value } })
    const series = option.series as { name: string; data: number[][]; itemStyle: { color: string } }[]
    const regimes = new Set(cells.map(c => c.regime))
    expect(series.length).toBe(regimes.size + 1)
    expect(series.slice(0, -1).reduce((n, s) => n + s.data.length, 0)).toBe(cells.length)
    expect(new Set(series.slice(0, -1).map(s => s.itemStyle.color)).size).toBe(regimes.size)
    expect(series.at(-1)!.data[0]).toEqual([f.capillaryNumber.value, f.flowRateRatio.value])
    expect(render(option).renderToSVGString()).toContain(f.regime.value)
  })
})
