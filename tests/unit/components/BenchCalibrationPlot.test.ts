// The calibration's residual plot reads as a plot: the axis values stand left of the plot area and no point covers
// them, the x axis shows the runs' range, and the title names what the residual is and what it is plotted against.
import { mount } from '@vue/test-utils'
import { describe, expect, it, vi } from 'vitest'
import BenchCalibration from '../../../components/bench/BenchCalibration.vue'
import type { CalibrationAnswer } from '../../../shared/types/bench'

vi.stubGlobal('useWhen', () => (iso: string) => iso)
vi.stubGlobal('computed', (await import('vue')).computed)

const answer = (model: 'squeezing-alpha' | 'step-ratio', xs: number[]): CalibrationAnswer => ({
  calibrations: [
    {
      kind: model === 'squeezing-alpha' ? 't-junction' : 'step-nozzle',
      junctionKind: model === 'squeezing-alpha' ? 't-junction' : 'step-nozzle',
      model,
      parameter: model === 'squeezing-alpha' ? 'α (L/w = 1 + α Qd/Qc)' : 'd/h',
      fit: {
        value: 1.1,
        standardError: 0.2,
        interval95: [0.6, 1.6],
        points: xs.length,
        method: 'through-origin',
        source: 'least squares through the origin',
      },
      runs: xs.length,
      latestRunAt: '2026-12-04T00:00:00Z',
      residuals: xs.map((x, i) => ({ runId: `r${i}`, x, y: 1, fitted: 1, residual: i % 2 ? -0.46 : 0.46 })), // axis ± 1.2 × 0.46 = 0.55,
    },
  ],
  design: null,
})

const plot = (a: CalibrationAnswer) => {
  const svg = mount(BenchCalibration, { props: { answer: a, document: null, canSwitch: false, busy: false } }).find(
    'svg',
  )
  const axis = Number(svg.findAll('line')[1]!.attributes('x1'))
  const points = svg.findAll('circle').map(c => Number(c.attributes('cx')))
  const texts = svg
    .findAll('text')
    .map(t => ({ x: Number(t.attributes('x')), anchor: t.attributes('text-anchor'), text: t.text() }))
  return { axis, points, texts }
}

describe('the residual plot', () => {
  it('keeps the points clear of the axis values, and shows the x range of the runs', () => {
    const { axis, points, texts } = plot(answer('squeezing-alpha', [0.25, 0.5, 1]))
    for (const cx of points) expect(cx).toBeGreaterThanOrEqual(axis + 5)
    const values = texts.filter(t => /^[+−]0\.55$|^0$/.test(t.text))
    expect(values).toHaveLength(3)
    for (const v of values) expect(v.anchor === 'end' && v.x < axis).toBe(true)
    expect(texts.map(t => t.text)).toEqual(expect.arrayContaining(['0.25', '1']))
    expect(texts[0]!.text).toBe('L/w − 1, measured − fitted, against Qd/Qc')
  })

  it('puts runs at one x in the middle, with that x beneath them; sizes are in µm', () => {
    const { axis, points, texts } = plot(answer('step-ratio', [20, 20]))
    expect(points[0]).toBe(points[1])
    expect(points[0]).toBeGreaterThan(axis + 50)
    const tick = texts.find(t => t.text === '20')!
    expect(tick.x).toBe(points[0])
    expect(texts[0]!.text).toBe('µm, measured − fitted, against depth h (µm)')
  })
})
