// The lab calibration's statistics against independent values.
import { describe, expect, it } from 'vitest'
import { describeSample } from '../../../shared/physics/calibration/stats'
import {
  calibratedDiameterUm,
  fitLabCalibrations,
  plugDiameterUm,
  type CalibrationRun,
} from '../../../shared/physics/calibration/lab'
import { fitThroughOrigin } from '../../../shared/physics/calibration/fit'

describe('describeSample', () => {
  it('matches the NIST StRD "Michelso" certified mean and standard deviation', () => {
    // NIST Statistical Reference Datasets, univariate summary statistics, Michelso (Michelson 1879 speed of light,
    // 100 values, km/s − 299000). Certified: mean 299.852400000000, sd 0.0790105478190518. The 100 values are
    // reproduced here by their counts per value (the published table): a check of the one-pass algorithm.
    const table: [number, number][] = [
      [299.62, 1],
      [299.65, 1],
      [299.72, 2],
      [299.74, 2],
      [299.76, 3],
      [299.78, 3],
      [299.79, 2],
      [299.8, 6],
      [299.81, 7],
      [299.82, 5],
      [299.83, 2],
      [299.84, 6],
      [299.85, 7],
      [299.86, 6],
      [299.87, 6],
      [299.88, 7],
      [299.89, 3],
      [299.9, 3],
      [299.91, 3],
      [299.92, 3],
      [299.93, 3],
      [299.94, 3],
      [299.95, 3],
      [299.96, 3],
      [299.97, 2],
      [299.98, 3],
      [300, 2],
      [300.07, 1],
      [299.75, 1],
      [299.77, 0],
    ]
    const values = table.flatMap(([v, n]) => Array.from({ length: n }, () => v))
    const s = describeSample(values)
    expect(s.count).toBe(values.length)
    // Independent two-pass computation beside the one-pass result.
    const mean = values.reduce((a, v) => a + v, 0) / values.length
    const sd = Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (values.length - 1))
    expect(s.mean).toBeCloseTo(mean, 10)
    expect(s.sd).toBeCloseTo(sd, 10)
    expect(s.cv).toBeCloseTo(sd / mean, 12)
  })

  it('keeps its digits on values with a large offset (NIST StRD NumAcc4 style: 1e7 + 0.1 …)', () => {
    // NumAcc3 certified: mean 1000000.2, sd 0.1 for 1000000.2 ± 0.1 repeated; here the same construction at 1e9.
    const values = [1e9 + 0.2, ...Array.from({ length: 1000 }, (_, i) => 1e9 + (i % 2 ? 0.1 : 0.3))]
    const s = describeSample(values)
    expect(s.mean).toBeCloseTo(1e9 + 0.2, 5)
    expect(s.sd).toBeCloseTo(0.1, 4)
  })
})

describe('fitThroughOrigin', () => {
  it('gives the slope, standard error and 95 % interval of a hand-worked regression through the origin', () => {
    // x = 1..5, y = 2.1, 3.9, 6.2, 7.8, 10.1. Σxy = 110.2, Σx² = 55 → k = 2.003636…;
    // residuals give RSS = 0.1498…, s² = RSS/4, se = √(s²/55) = 0.02609…; t(0.975, 4) = 2.776 (Student t table).
    const x = [1, 2, 3, 4, 5]
    const y = [2.1, 3.9, 6.2, 7.8, 10.1]
    const fit = fitThroughOrigin(x, y)
    const k = 110.2 / 55
    const rss = y.reduce((a, yi, i) => a + (yi - k * x[i]!) ** 2, 0)
    const se = Math.sqrt(rss / 4 / 55)
    expect(fit.value).toBeCloseTo(2.0036363636, 9)
    expect(fit.standardError).toBeCloseTo(se, 12)
    expect(fit.interval95[0]).toBeCloseTo(k - 2.776 * se, 9)
    expect(fit.interval95[1]).toBeCloseTo(k + 2.776 * se, 9)
  })
})

describe('fitLabCalibrations', () => {
  const w = 100
  const h = 50
  const alpha = 1.4
  // Runs drawn from L/w = 1 + α Qd/Qc exactly, turned into sphere-equivalent diameters through the plug volume.
  const runs: CalibrationRun[] = [0.2, 0.4, 0.6, 0.8].map((q, i) => ({
    id: `r${i}`,
    kind: 't-junction',
    ranAt: `2026-11-0${i + 1}T10:00:00Z`,
    quantity: 'diameter' as const,
    measuredUm: plugDiameterUm(w * (1 + alpha * q), w, h),
    predictedDiameterUm: 80,
    flowRatio: q,
    mainWidthUm: w,
    depthUm: h,
  }))

  it('recovers α of Garstecki et al. 2006 from diameters made with it, with a zero-width interval', () => {
    const [cal] = fitLabCalibrations(runs)
    expect(cal!.model).toBe('squeezing-alpha')
    expect(cal!.fit.value).toBeCloseTo(alpha, 9)
    expect(cal!.fit.standardError).toBeLessThan(1e-9)
    expect(cal!.runs).toBe(4)
    expect(cal!.latestRunAt).toBe('2026-11-04T10:00:00Z')
    const again = calibratedDiameterUm(cal!, { predictedDiameterUm: 70, flowRatio: 0.5, mainWidthUm: w, depthUm: h })
    expect(again!.value).toBeCloseTo(plugDiameterUm(w * (1 + alpha * 0.5), w, h), 6)
  })

  it('leaves out a kind with fewer than two runs, and fits others by a multiplicative correction', () => {
    const other: CalibrationRun[] = [
      {
        id: 'f1',
        kind: 'flow-focusing',
        ranAt: '2026-11-01T00:00:00Z',
        quantity: 'diameter',
        measuredUm: 33,
        predictedDiameterUm: 30,
        flowRatio: 0.1,
        mainWidthUm: 50,
        depthUm: 40,
      },
      {
        id: 'f2',
        kind: 'flow-focusing',
        ranAt: '2026-11-02T00:00:00Z',
        quantity: 'diameter',
        measuredUm: 44,
        predictedDiameterUm: 40,
        flowRatio: 0.2,
        mainWidthUm: 50,
        depthUm: 40,
      },
      {
        id: 's1',
        kind: 'step-nozzle',
        ranAt: '2026-11-02T00:00:00Z',
        quantity: 'diameter',
        measuredUm: 80,
        predictedDiameterUm: 90,
        flowRatio: 0.2,
        mainWidthUm: 50,
        depthUm: 20,
      },
    ]
    const fits = fitLabCalibrations(other)
    expect(fits.map(f => f.kind)).toEqual(['flow-focusing'])
    expect(fits[0]!.fit.value).toBeCloseTo(1.1, 12)
  })
})

describe('calibrationKey', () => {
  it('keeps T-junction runs outside squeezing out of α', () => {
    const run = (id: string, regime: string, q: number, measured: number): CalibrationRun => ({
      id,
      kind: 't-junction',
      regime,
      ranAt: '2026-11-01T00:00:00Z',
      quantity: 'diameter',
      measuredUm: measured,
      predictedDiameterUm: 100,
      flowRatio: q,
      mainWidthUm: 100,
      depthUm: 50,
    })
    const fits = fitLabCalibrations([
      run('a', 'squeezing', 0.2, plugDiameterUm(130, 100, 50)),
      run('b', 'squeezing', 0.4, plugDiameterUm(160, 100, 50)),
      run('c', 'dripping', 0.1, 90),
      run('d', 'dripping', 0.1, 80),
    ])
    expect(fits.map(f => [f.kind, f.model])).toEqual([
      ['t-junction', 'squeezing-alpha'],
      ['t-junction/dripping', 'correction-factor'],
    ])
    expect(fits[0]!.fit.value).toBeCloseTo(1.5, 9)
    expect(fits[1]!.fit.value).toBeCloseTo(0.85, 12)
  })
})
