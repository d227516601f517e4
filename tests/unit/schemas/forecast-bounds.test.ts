// Forecast inputs at every corner of their bounds (shared/schemas/quantity.ts DIMENSIONS): the forecast answers
// or refuses with ForecastInputError (400), never an internal error (500). Beyond a bound: refused with it.
import { describe, expect, it } from 'vitest'
import { ForecastInputError, runForecast } from '#shared/physics/forecast'
import { DIMENSIONS, type Dimension } from '#shared/schemas/quantity'

const FIELDS: Array<[string[], Dimension]> = [
  [['junction', 'mainWidth'], 'length'],
  [['junction', 'inletWidth'], 'length'],
  [['junction', 'depth'], 'length'],
  [['continuous', 'viscosity'], 'viscosity'],
  [['continuous', 'density'], 'density'],
  [['interfacialTension'], 'surfaceTension'],
  [['temperature'], 'temperature'],
  [['flow', 'continuous'], 'volumeFlow'],
  [['flow', 'dispersed'], 'volumeFlow'],
]
const set = (o: any, path: string[], v: unknown) => {
  let x = o
  for (const k of path.slice(0, -1)) x = x[k]
  x[path[path.length - 1]!] = v
}
const request = (kind: string) => ({
  junction: { kind, mainWidth: 1e-4, inletWidth: 5e-5, depth: 5e-5 },
  continuous: { viscosity: 3e-3, density: 800 },
  dispersed: { liquid: 'water' },
  interfacialTension: 5e-3,
  temperature: 293.15,
  flow: { continuous: 1.7e-10, dispersed: 0.8e-10 },
})
function outcome(req: unknown): 'answer' | 'refused' {
  try {
    runForecast(req)
    return 'answer'
  } catch (error) {
    if (error instanceof ForecastInputError) return 'refused'
    throw new Error(`internal error for ${JSON.stringify(req)}: ${(error as Error).message}`)
  }
}

describe('forecast bounds', () => {
  for (const kind of ['t-junction', 'flow-focusing', 'step']) {
    it(`${kind}: all 512 corners of the accepted ranges answer or refuse, none is an internal error`, () => {
      let answers = 0
      for (let mask = 0; mask < 1 << FIELDS.length; mask++) {
        const req = request(kind)
        FIELDS.forEach(([path, dim], i) => set(req, path, mask & (1 << i) ? DIMENSIONS[dim].max : DIMENSIONS[dim].min))
        if (outcome(req) === 'answer') answers++
      }
      expect(answers).toBeGreaterThan(0)
    })
  }
  it('a network at the corners of its ranges answers or refuses', () => {
    for (const width of [DIMENSIONS.length.min, DIMENSIONS.length.max])
      for (const length of [DIMENSIONS.length.min, DIMENSIONS.length.max]) {
        for (const p of [DIMENSIONS.pressure.max, -DIMENSIONS.pressure.max, 0])
          for (const viscosity of [DIMENSIONS.viscosity.min, DIMENSIONS.viscosity.max]) {
            outcome({
              network: {
                channels: [
                  { id: 'a', from: 'in', to: 'mid', width, depth: width, length },
                  { id: 't', from: 'mid', to: 'out', diameter: width, length },
                ],
                sources: [
                  { node: 'in', pressure: p },
                  { node: 'out', pressure: 0 },
                ],
                liquid: { viscosity, density: 1000 },
              },
            })
            outcome({
              network: {
                channels: [{ id: 'a', from: 'in', to: 'out', width, depth: width, length }],
                sources: [
                  { node: 'in', flow: DIMENSIONS.volumeFlow.max },
                  { node: 'out', pressure: 0 },
                ],
                liquid: { viscosity, density: 1000 },
              },
            })
          }
      }
  })
  it('beyond a bound the field is refused with the bound', () => {
    const cases: Array<[string[], unknown, RegExp]> = [
      [['junction', 'mainWidth'], 1e300, /junction\.mainWidth: must be at most 10 m/],
      [['junction', 'depth'], '1 pm', /junction\.depth: must be at least 10 nm/],
      [['flow', 'continuous'], '2 L/s', /flow\.continuous: must be at most 1 L\/s/],
      [['temperature'], '400 degC', /temperature: must be at most 300 degC/],
      [['continuous', 'viscosity'], 1e300, /continuous\.viscosity: must be at most 10000 Pa\*s/],
    ]
    for (const [path, value, message] of cases) {
      const req = request('t-junction')
      set(req, path, value)
      expect(() => runForecast(req)).toThrow(message)
    }
  })
})
