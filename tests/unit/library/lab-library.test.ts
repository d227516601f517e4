// The lab's entries merged with the built-in library (pure core): interpolation of a temperature table, the
// ±10 K window of a single row, lab pairs winning over built-in ones, and lab processes as rule inputs.
import { describe, expect, it } from 'vitest'
import { findPair, labLiquid, mergeLibrary, BUILT_IN_LIBRARY, type LabLiquidData } from '#shared/physics/liquids'
import { findProcessIn, labProcess } from '~~/geometry/rules/processes'

const K = (c: number) => (c + 273.15) as never

// Invented lab values.
const table: LabLiquidData = {
  id: 'lab-oil',
  name: 'Lab oil',
  source: 'measured in our lab',
  table: [
    { temperatureC: 40, viscosityMPaS: 2, densityKgPerM3: 790 },
    { temperatureC: 20, viscosityMPaS: 4, densityKgPerM3: 810 },
  ],
}

describe('lab liquids', () => {
  it('interpolates ln μ linearly in 1/T (Andrade form) and ρ linearly in T between rows, whatever the row order', () => {
    const { liquid, warnings } = labLiquid(table).properties(K(30))
    // Independent: ln μ(30 °C) = ln 4 + (ln 2 − ln 4)·(1/303.15 − 1/293.15)/(1/313.15 − 1/293.15)
    const s = (1 / 303.15 - 1 / 293.15) / (1 / 313.15 - 1 / 293.15)
    expect(liquid.viscosity.value).toBeCloseTo(Math.exp(Math.log(4e-3) + (Math.log(2e-3) - Math.log(4e-3)) * s), 12)
    expect(liquid.density.value).toBeCloseTo(800, 9)
    expect(liquid.viscosity.valid).toBe(true)
    expect(warnings).toEqual([])
    expect(liquid.surfaceTension).toBeUndefined()
    expect(labLiquid(table).properties(K(20)).liquid.viscosity.value).toBeCloseTo(4e-3, 15)
  })

  it('outside the table: the nearest row, marked invalid with a warning', () => {
    const { liquid, warnings } = labLiquid(table).properties(K(60))
    expect(liquid.viscosity.value).toBeCloseTo(2e-3, 15)
    expect(liquid.viscosity.valid).toBe(false)
    expect(warnings[0]!.code).toBe('liquid-temperature-out-of-range')
  })

  it('a single row is valid ±10 K around it, like the built-in oils', () => {
    const one = labLiquid({
      ...table,
      table: [{ temperatureC: 25, viscosityMPaS: 3, densityKgPerM3: 800, surfaceTensionMNPerM: 27 }],
    })
    expect(one.properties(K(34)).liquid.viscosity.valid).toBe(true)
    expect(one.properties(K(36)).liquid.viscosity.valid).toBe(false)
    expect(one.properties(K(30)).liquid.surfaceTension!.value).toBeCloseTo(27e-3, 15)
    expect(one.origin).toBe('lab')
  })
})

describe('merged library', () => {
  it('without lab entries it is the built-in library itself', () => {
    expect(mergeLibrary(null)).toBe(BUILT_IN_LIBRARY)
    expect(mergeLibrary({ liquids: [], pairs: [] })).toBe(BUILT_IN_LIBRARY)
  })

  it('a lab pair wins over the built-in pair of the same liquids and surfactant; a new surfactant is listed', () => {
    const lib = mergeLibrary({
      liquids: [table],
      pairs: [
        {
          liquids: ['n-hexadecane', 'water'],
          surfactant: 'sorbitan-monooleate',
          interfacialTensionMNPerM: 3.1,
          source: 'measured in our lab',
        },
        {
          liquids: ['water', 'lab-oil'],
          surfactant: 'our-mix',
          interfacialTensionMNPerM: 2,
          source: 'measured in our lab',
        },
      ],
    })
    expect(findPair('water', 'n-hexadecane', 'sorbitan-monooleate', lib.pairs)!.interfacialTension).toBeCloseTo(
      3.1e-3,
      15,
    )
    expect(findPair('water', 'n-hexadecane', 'sorbitan-monooleate')!.interfacialTension).toBeCloseTo(4e-3, 15) // built-in untouched
    expect(lib.surfactants).toContain('our-mix')
    expect(lib.liquids.some(l => l.id === 'lab-oil')).toBe(true)
  })
})

describe('lab processes', () => {
  it('carry the lab source on every rule value and are found beside the built-in ones', () => {
    const data = {
      id: 'lab-fine',
      name: 'Fine',
      material: 'PDMS' as const,
      minFeature: 5,
      minGap: 5,
      minDepth: 2,
      maxDepth: 100,
      maxWidthToDepth: 15,
      maxWallDepthToWidth: 4,
      portEdgeDistance: 800,
      portSpacing: 800,
      bondPressureLimitMbar: 1500,
      source: 'measured in our lab',
    }
    expect(labProcess(data).sources.bondPressureLimitMbar).toContain('measured in our lab')
    expect(findProcessIn('lab-fine', [data])!.minFeature).toBe(5)
    expect(findProcessIn('lab-fine')).toBeUndefined()
    expect(findProcessIn('film-mask-soft-litho', [data])!.minFeature).toBe(20)
  })
})
