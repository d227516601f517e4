// Property test (fast-check) over the whole junction and network request space: whatever a lab sends within
// the schema's limits, the forecast answers (or names the field), every number is finite, the quantities
// physics says are positive are positive, and every number marked invalid comes with a warning.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { ForecastInputError, runForecast, type JunctionForecast, type NetworkForecast } from '#shared/physics/forecast'
import { LIQUIDS } from '#shared/physics/liquids'

const RUNS = Number(process.env.DW_PROPERTY_RUNS ?? 400)
const logUniform = (min: number, max: number) =>
  fc.double({ min: Math.log10(min), max: Math.log10(max), noNaN: true }).map(e => 10 ** e)

const explicitLiquid = fc.record({ viscosity: logUniform(1e-5, 10), density: logUniform(1, 25_000) })
const libraryLiquid = fc
  .constantFrom(...LIQUIDS.map(l => l.id))
  .chain(id =>
    id === 'glycerol-water'
      ? fc.double({ min: 0, max: 1, noNaN: true }).map(massFraction => ({ liquid: id, massFraction }))
      : fc.constant({ liquid: id }),
  )
const liquid = fc.oneof(explicitLiquid, libraryLiquid)

const junctionRequest = fc
  .record({
    junction: fc.record({
      kind: fc.constantFrom('t-junction', 'flow-focusing', 'step'),
      mainWidth: logUniform(1e-7, 1e-2),
      inletWidth: fc.option(logUniform(1e-7, 1e-2), { nil: undefined }),
      depth: logUniform(1e-7, 1e-2),
    }),
    continuous: liquid,
    dispersed: liquid,
    interfacialTension: logUniform(1e-5, 0.5),
    contactAngle: fc.option(fc.double({ min: 0, max: Math.PI, noNaN: true }), { nil: undefined }),
    temperature: fc.option(fc.double({ min: 180, max: 570, noNaN: true }), { nil: undefined }),
    flow: fc.record({ continuous: logUniform(1e-16, 1e-4), dispersed: logUniform(1e-16, 1e-4) }),
    model: fc.option(fc.record({ alpha: logUniform(1e-3, 100) }), { nil: undefined }),
  })
  .map(r => JSON.parse(JSON.stringify(r)))

type Q = { value: number; valid: boolean; unit: string }
const isQuantity = (x: unknown): x is Q =>
  typeof x === 'object' && x !== null && 'value' in x && 'valid' in x && 'unit' in x

function numbers(value: unknown, out: number[] = []): number[] {
  if (typeof value === 'number') out.push(value)
  else if (value && typeof value === 'object') for (const v of Object.values(value)) numbers(v, out)
  return out
}
function quantities(value: unknown, out: Q[] = []): Q[] {
  if (isQuantity(value)) out.push(value)
  else if (value && typeof value === 'object') for (const v of Object.values(value)) quantities(v, out)
  return out
}

/** Runs the request; an input error must name a field of the request. */
function answer<T>(request: unknown): T | undefined {
  try {
    return runForecast(request) as T
  } catch (error) {
    if (!(error instanceof ForecastInputError)) throw error
    for (const issue of error.issues) expect(issue.path.length + issue.message.length).toBeGreaterThan(0)
    return undefined
  }
}

describe('property: junction requests', () => {
  it(`every answered quantity is finite, positive where physics says so, and valid or flagged (${RUNS} requests)`, () => {
    fc.assert(
      fc.property(junctionRequest, request => {
        const a = answer<JunctionForecast>(request)
        if (!a) return
        expect(numbers(a).every(Number.isFinite)).toBe(true)
        for (const key of [
          'dropletVolume',
          'dropletDiameter',
          'frequency',
          'capillaryNumber',
          'reynoldsNumber',
          'weberNumber',
          'laplacePressure',
          'viscosityRatio',
          'flowRateRatio',
        ] as const) {
          expect(a[key].value, key).toBeGreaterThan(0)
        }
        for (const key of ['dropletLength', 'spacing', 'capillaryLength'] as const)
          if (a[key]) expect(a[key]!.value, key).toBeGreaterThan(0)
        expect(a.dispersedFraction.value).toBeGreaterThan(0)
        expect(a.dispersedFraction.value).toBeLessThan(1)
        // A number outside its method's domain is flagged, and a flag always comes with a warning saying why.
        if (quantities(a).some(q => !q.valid) || !a.regime.valid) expect(a.warnings.length).toBeGreaterThan(0)
        // A size marked valid comes from a regime its law covers.
        if (a.dropletVolume.valid) expect(['squeezing', 'step-emulsification']).toContain(a.regime.value)
      }),
      { numRuns: RUNS, seed: Number(process.env.DW_PROPERTY_SEED ?? 11) },
    )
  }, 120_000)
})

const networkRequest = fc
  .record({
    rungs: fc.integer({ min: 1, max: 12 }),
    width: logUniform(1e-7, 1e-2),
    depth: logUniform(1e-7, 1e-2),
    length: logUniform(1e-7, 5),
    flow: logUniform(1e-16, 1e-4),
    suction: fc.boolean(),
    pressure: logUniform(1e-2, 1e7),
    liquid,
  })
  .map(p => {
    const channels = []
    for (let i = 0; i < p.rungs; i++) {
      channels.push({ id: `a${i}`, from: `A${i}`, to: `A${i + 1}`, width: p.width, depth: p.depth, length: p.length })
      channels.push({
        id: `n${i}`,
        from: `A${i + 1}`,
        to: `B${i + 1}`,
        width: p.width / 2,
        depth: p.depth,
        length: p.length,
      })
      channels.push({ id: `b${i}`, from: `B${i}`, to: `B${i + 1}`, width: p.width, depth: p.depth, length: p.length })
    }
    channels.push({ id: 'tail', from: `B${p.rungs}`, to: 'out', diameter: p.depth, length: p.length })
    channels.push({ id: 'head', from: 'B0', to: 'A0', width: p.width, depth: p.depth, length: p.length })
    const sources = [
      { node: 'A0', flow: p.flow },
      { node: 'out', pressure: p.suction ? -p.pressure : 0 },
    ]
    return { network: { channels, sources, liquid: p.liquid, limits: { bondPressure: 2e5, pumpPressure: 1e5 } } }
  })

describe('property: network requests', () => {
  it(`every answered number is finite, resistances positive, flow conserved, a limit breached is warned (${RUNS} networks)`, () => {
    fc.assert(
      fc.property(networkRequest, request => {
        const a = answer<NetworkForecast>(request)
        if (!a) return
        expect(numbers(a).every(Number.isFinite)).toBe(true)
        for (const c of a.channels) expect(c.resistance.value).toBeGreaterThan(0)
        const supplied = a.inlets.reduce((sum, i) => sum + i.flow.value, 0)
        // Kirchhoff: the sources' flows sum to zero, to 1e-8 of the largest (PCG stops at 1e-13 relative residual; widths and depths 1e5 apart cost digits).
        expect(Math.abs(supplied)).toBeLessThanOrEqual(1e-8 * Math.max(...a.inlets.map(i => Math.abs(i.flow.value))))
        for (const m of Object.values(a.margins ?? {}))
          if (!m.ok) expect(a.warnings.map(w => w.code)).toContain('pressure-limit')
      }),
      { numRuns: RUNS, seed: Number(process.env.DW_PROPERTY_SEED ?? 11) },
    )
  }, 120_000)
})
