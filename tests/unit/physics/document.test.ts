import { describe, expect, it } from 'vitest'
import { requireChipDocument, type ChipDocument } from '#shared/schemas/chip'
import { forecastDocument, summarizeForecast, type DocumentForecast } from '#shared/physics/document'
import { ForecastInputError, runForecast, type JunctionForecast } from '#shared/physics/forecast'
import { rectangularResistance } from '#shared/physics/hydraulics/resistance'
import type { Metres, PascalSeconds } from '#shared/physics/units'
import { loadDocument, mixedChip } from './document-helpers'

const UL_PER_MIN = 1e-9 / 60
const relative = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), Number.MIN_VALUE)

function issuesOf(run: () => unknown) {
  try {
    run()
  } catch (error) {
    expect(error).toBeInstanceOf(ForecastInputError)
    return (error as ForecastInputError).issues
  }
  throw new Error('expected a ForecastInputError')
}

const edit = (doc: ChipDocument, patch: (d: ChipDocument) => void): unknown => {
  const copy = structuredClone(doc)
  patch(copy)
  return copy
}

describe('document forecast: the T-junction fixture', () => {
  const doc = loadDocument('t-junction-basic')
  const answer = forecastDocument(doc)
  const tj = answer.junctions.find(j => j.id === 'tj-1')!

  it('carries the inlet flows through the T-junction arms (flow sources, Kirchhoff)', () => {
    const flow = (id: string) => answer.network.channels.find(c => c.id === id)!.flow.value
    expect(relative(flow('tj-1/continuous'), 10 * UL_PER_MIN)).toBeLessThan(1e-12)
    expect(relative(flow('tj-1/dispersed'), 5 * UL_PER_MIN)).toBeLessThan(1e-12)
    expect(relative(flow('drops-out'), 15 * UL_PER_MIN)).toBeLessThan(1e-12)
    expect(answer.operatingPoint.id).toBe('op-1')
  })

  it('gives the same Ca and droplet length as the single-junction API for the same widths and flows', () => {
    const single = runForecast({
      junction: { kind: 't-junction', mainWidth: '100 um', inletWidth: '50 um', depth: '50 um' },
      continuous: { liquid: 'n-hexadecane' },
      dispersed: { liquid: 'water' },
      surfactant: 'sorbitan-monooleate',
      temperature: '22 degC',
      flow: { continuous: '10 uL/min', dispersed: '5 uL/min' },
    }) as JunctionForecast
    const f = tj.forecast!
    expect(relative(f.capillaryNumber.value, single.capillaryNumber.value)).toBeLessThan(1e-9)
    expect(relative(f.dropletLength!.value, single.dropletLength!.value)).toBeLessThan(1e-9)
    expect(f.dropletLength!.method).toBe(single.dropletLength!.method)
    expect(f.regime.value).toBe(single.regime.value)
    // By hand: Ca = μc Qc / (w h γ) with the resolved liquid and tension (Christopher & Anna 2007 convention).
    const ca =
      (f.inputs.continuous.viscosity.value * 10 * UL_PER_MIN) / (100e-6 * 50e-6 * f.inputs.interfacialTension.value)
    expect(relative(f.capillaryNumber.value, ca)).toBeLessThan(1e-9)
  })

  it("needs the inlet pressure of the series path, by Bruus's exact rectangular resistance plus the drops' share", () => {
    const mu = answer.network.liquid.viscosity.value as PascalSeconds
    const r = (length: number, width: number) =>
      rectangularResistance(mu, (length * 1e-6) as Metres, (width * 1e-6) as Metres, 50e-6 as Metres)
    const qc = 10 * UL_PER_MIN
    const qd = 5 * UL_PER_MIN
    const drops = answer.network.channels
      .filter(c => c.liquid === 'emulsion')
      .reduce((sum, c) => sum + Math.abs(c.dropletPressureDrop.value), 0)
    expect(drops).toBeGreaterThan(0)
    // oil-feed 3300 µm; arms 200 µm; drops-out 3300 µm; outlet at 0 Pa.
    const expected = qc * (r(3300, 100) + r(200, 100)) + (qc + qd) * (r(200, 100) + r(3300, 100)) + drops
    const oil = answer.network.inlets.find(i => i.port === 'oil-in')!
    expect(relative(oil.pressure.value, expected)).toBeLessThan(1e-9)
    expect(oil.flow.value).toBeCloseTo(qc, 20)
  })

  it('answers the same through runForecast with the document request, and reports margins', () => {
    const viaApi = runForecast({
      document: JSON.parse(JSON.stringify(doc)),
      limits: { bondPressure: '2 bar', pumpPressure: '50 mbar' },
    }) as DocumentForecast
    expect(viaApi.junctions[0]!.forecast!.capillaryNumber.value).toBe(tj.forecast!.capillaryNumber.value)
    expect(viaApi.network.margins!.bondPressure!.ok).toBe(true)
    expect(viaApi.network.margins!.pumpPressure!.ok).toBe(false)
    expect(viaApi.warnings.map(w => w.code)).toContain('pressure-limit')
  })

  it('summarizes per junction and per inlet in lab units, four significant figures', () => {
    const summary = summarizeForecast(answer)
    expect(summary.junctions).toEqual([
      {
        id: 'tj-1',
        kind: 't-junction',
        regime: tj.forecast!.regime.value,
        dropletDiameterUm: Number((tj.forecast!.dropletDiameter.value * 1e6).toPrecision(4)),
        frequencyHz: Number(tj.forecast!.frequency.value.toPrecision(4)),
        valid: false, // dripping at this Ca: the squeezing law is an upper bound
      },
    ])
    const oil = answer.network.inlets.find(i => i.port === 'oil-in')!
    // 1 m³/s = 6e10 µL/min: the oil inlet's set 10 µL/min comes back as its solved flow.
    expect(summary.inlets).toContainEqual({
      portId: 'oil-in',
      mode: 'flow',
      pressureMbar: Number((oil.pressure.value / 100).toPrecision(4)),
      flowUlPerMin: 10,
    })
  })
})

describe('document forecast: errors name the element and the fix', () => {
  const doc = loadDocument('t-junction-basic')

  it('a bad channel width', () => {
    const issues = issuesOf(() => runForecast({ document: edit(doc, d => (d.channels[1]!.width = -3)) }))
    expect(issues[0]!.path).toBe('document.channels[1].width')
    expect(issues[0]!.message).toMatch(/water-feed/)
    expect(issues[0]!.message).toMatch(/> 0 µm/)
  })

  it('a stray channel touching no inlet or outlet is left out with a warning, and no other number changes', () => {
    const stray = {
      id: 'stray',
      layerId: 'ch50',
      width: 80,
      points: [
        { x: 100, y: 6000 },
        { x: 900, y: 6000 },
      ],
    }
    const answer = forecastDocument(requireChipDocument(edit(doc, d => d.channels.push(stray))))
    const warning = answer.warnings.find(w => w.code === 'channels-unconnected')!
    expect(warning).toMatchObject({ element: 'stray' })
    expect(warning.message).toMatch(/"stray" is not connected to any inlet or outlet, so it carries no flow/)
    const plain = forecastDocument(doc)
    expect(answer.junctions[0]!.forecast!.dropletDiameter.value).toBe(
      plain.junctions[0]!.forecast!.dropletDiameter.value,
    )
    expect(answer.network.inlets.map(i => i.pressure.value)).toEqual(plain.network.inlets.map(i => i.pressure.value))
  })

  it('a fed sub-network with no way out still fails, naming its elements', () => {
    const issues = issuesOf(() =>
      forecastDocument(
        requireChipDocument(
          edit(doc, d => {
            d.ports.push({
              id: 'extra-in',
              kind: 'inlet',
              position: { x: 100, y: 6000 },
              punchDiameter: 750,
              layerId: 'ch50',
              feed: { phase: 'continuous' },
            })
            d.channels.push({
              id: 'dead-end',
              layerId: 'ch50',
              width: 80,
              points: [
                { x: 100, y: 6000 },
                { x: 900, y: 6000 },
              ],
              start: { element: 'extra-in', terminal: 'port' },
            })
            d.operatingPoints[0]!.inlets.push({ portId: 'extra-in', mode: 'flow', value: 1, unit: 'uL/min' })
          }),
        ),
      ),
    )
    expect(issues[0]!.message).toMatch(/channel "dead-end"/)
    expect(issues[0]!.message).toMatch(/not connected to any outlet/i)
  })

  it('an inlet with no feed in the operating point', () => {
    const issues = issuesOf(() =>
      forecastDocument(requireChipDocument(edit(doc, d => d.operatingPoints[0]!.inlets.pop()))),
    )
    expect(issues[0]!.path).toBe('document.operatingPoints[0].inlets')
    expect(issues[0]!.message).toMatch(/Inlet port "water-in" has no feed in operating point "op-1"/)
  })

  it('an unknown operating point, and an unknown liquid', () => {
    expect(issuesOf(() => forecastDocument(doc, 'op-9'))[0]).toMatchObject({
      path: 'operatingPoint',
      message: expect.stringMatching(/use one of "op-1"/),
    })
    const issues = issuesOf(() =>
      forecastDocument(
        requireChipDocument(edit(doc, d => (d.operatingPoints[0]!.continuousLiquid = { liquid: 'castor' }))),
      ),
    )
    expect(issues[0]!.path).toBe('document.operatingPoints[0].continuousLiquid.liquid')
  })

  it('a junction whose dispersed flow is zero is a warning, not a crash', () => {
    const answer = forecastDocument(requireChipDocument(edit(doc, d => (d.operatingPoints[0]!.inlets[1]!.value = 0))))
    expect(answer.junctions[0]!.forecast).toBeNull()
    expect(answer.warnings).toContainEqual(expect.objectContaining({ code: 'no-dispersed-flow', element: 'tj-1' }))
    expect(summarizeForecast(answer).junctions[0]).toMatchObject({
      regime: null,
      dropletDiameterUm: null,
      valid: false,
    })
  })

  it('a missing interfacial tension still solves the network and says how to give it', () => {
    const answer = forecastDocument(requireChipDocument(edit(doc, d => delete d.operatingPoints[0]!.surfactant)))
    expect(answer.network.inlets).toHaveLength(2)
    // water/n-hexadecane without surfactant is in the library, so this one is forecast:
    expect(answer.junctions[0]!.forecast).not.toBeNull()
    const unknownPair = forecastDocument(
      requireChipDocument(
        edit(doc, d => (d.operatingPoints[0]!.continuousLiquid = { viscosityMPaS: 3, densityKgPerM3: 800 })),
      ),
    )
    expect(unknownPair.junctions[0]!.forecast).toBeNull()
    expect(unknownPair.warnings).toContainEqual(
      expect.objectContaining({ code: 'tension-missing', message: expect.stringMatching(/interfacialTensionMNPerM/) }),
    )
  })
})

describe('document forecast: every junction kind', () => {
  const answer = forecastDocument(mixedChip())
  const junction = (id: string) => answer.junctions.find(j => j.id === id)!

  it('joins free channel ends by coincidence (a split and a joint on a serpentine terminal)', () => {
    const channel = (id: string) => answer.network.channels.find(c => c.id === id)!
    expect(channel('w-a').from).toBe('serp-1:outlet')
    expect(channel('w-b').from).toBe(channel('w-a').to)
    expect(relative(channel('o-a').flow.value + channel('o-b').flow.value, 20 * UL_PER_MIN)).toBeLessThan(1e-12)
    // The serpentine is one channel of its total length: 12 000 µm × 60 µm × 50 µm (Bruus 2008, exact series),
    // carrying the water feed, so with the dispersed phase's viscosity.
    expect(channel('serp-1/run').liquid).toBe('dispersed')
    const mu = channel('serp-1/run').viscosity.value as PascalSeconds
    expect(
      relative(
        channel('serp-1/run').resistance.value,
        rectangularResistance(mu, 12e-3 as Metres, 60e-6 as Metres, 50e-6 as Metres),
      ),
    ).toBeLessThan(1e-12)
  })

  it('forecasts flow-focusing from both continuous arms and the Y-junction as a lower-confidence T-junction', () => {
    const ff = junction('ff-1').forecast!
    expect(relative(ff.inputs.flow.continuous.value, 20 * UL_PER_MIN)).toBeLessThan(1e-12)
    expect(relative(ff.inputs.flow.dispersed.value, 2 * UL_PER_MIN)).toBeLessThan(1e-12)
    expect(ff.inputs.junction.mainWidth.value).toBeCloseTo(40e-6, 15)
    const yj = junction('yj-1').forecast!
    expect(yj.inputs.junction.kind).toBe('t-junction')
    expect(yj.dropletVolume.valid).toBe(false)
    expect(yj.warnings.map(w => w.code)).toContain('y-junction-lower-confidence')
    expect(relative(yj.inputs.flow.continuous.value, 23 * UL_PER_MIN)).toBeLessThan(1e-12)
  })

  it('forecasts every nozzle of a step array; their flows add up to the supply', () => {
    const nozzles = answer.junctions.filter(j => j.element === 'arr-1')
    expect(nozzles).toHaveLength(16)
    const supply = answer.network.inlets.find(i => i.port === 'arr-water')!.flow.value
    const total = nozzles.reduce((sum, j) => sum + j.forecast!.inputs.flow.dispersed.value, 0)
    expect(relative(total, supply)).toBeLessThan(1e-9)
    const set = answer.network.uniformity.find(u => u.junctions.includes('arr-1[0]'))!
    expect(set.count).toBe(16)
    expect(set.cv).toBeGreaterThan(0)
  })
})
