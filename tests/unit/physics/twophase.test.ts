// The two-phase network (shared/physics/document/twophase.ts) on the documented chip example
// (docs/forecast-api.md, "A chip document"), pressure-driven; the droplet-resistance laws against their papers.
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { requireChipDocument, type ChipDocument } from '#shared/schemas/chip'
import { forecastDocument, SINGLE_PHASE } from '#shared/physics/document'
import { rectangularResistance } from '#shared/physics/hydraulics/resistance'
import { confinedDropPressure, taylorRelativeViscosity } from '#shared/physics/twophase/droplets'
import type { Metres, PascalSeconds } from '#shared/physics/units'

const UL_PER_MIN = 1e-9 / 60
const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b)

/** The chip document of docs/forecast-api.md, as a lab would paste it. */
function documentedExample(): ChipDocument {
  const text = readFileSync(new URL('../../../docs/forecast-api.md', import.meta.url), 'utf8')
  const section = text.slice(text.indexOf('## A chip document'))
  const block = section.slice(section.indexOf('```json') + 7, section.indexOf('```', section.indexOf('```json') + 7))
  return requireChipDocument(JSON.parse(block).document)
}

const withWater = (mbar: number) => {
  const doc = documentedExample()
  doc.operatingPoints[0]!.inlets = doc.operatingPoints[0]!.inlets.map(i =>
    i.portId === 'water-in' ? { ...i, mode: 'pressure' as const, value: mbar, unit: 'mbar' as const } : i,
  )
  return doc
}

describe('two-phase network: the documented chip example (oil 10 µL/min, water at 80 mbar)', () => {
  const doc = withWater(80)
  const answer = forecastDocument(doc)
  const channel = (id: string) => answer.network.channels.find(c => c.id === id)!
  const node = (id: string) => answer.network.nodes.find(n => n.id === id)!.pressure.value

  it('gives each channel the liquid that flows in it', () => {
    expect(channel('water-feed').liquid).toBe('dispersed')
    expect(channel('tj-1/dispersed').liquid).toBe('dispersed')
    expect(channel('oil-feed').liquid).toBe('continuous')
    expect(channel('drops-out').liquid).toBe('emulsion')
    expect(channel('water-feed').viscosity.value).toBe(answer.junctions[0]!.forecast!.inputs.dispersed.viscosity.value)
    expect(answer.network.approximation.id).toBe('two-phase-network')
    expect(answer.network.inlets.map(i => [i.port, i.phase])).toEqual([
      ['oil-in', 'continuous'],
      ['water-in', 'dispersed'],
    ])
  })

  it('the water feed carries the flow its own viscosity allows (Bruus 2008 exact series with water, the arm holding its entry barrier)', () => {
    const muWater = channel('water-feed').viscosity.value as PascalSeconds
    // water-feed: 2300 µm × 50 µm × 50 µm; the T-junction's dispersed arm 200 µm × 50 µm × 50 µm.
    const r =
      rectangularResistance(muWater, 2300e-6 as Metres, 50e-6 as Metres, 50e-6 as Metres) +
      rectangularResistance(muWater, 200e-6 as Metres, 50e-6 as Metres, 50e-6 as Metres)
    const barrier = channel('tj-1/dispersed').entryBarrier!.value
    const expected = (8000 - barrier - node('tj-1:centre')) / r
    const qd = answer.network.inlets.find(i => i.port === 'water-in')!.flow.value
    expect(relative(qd, expected)).toBeLessThan(1e-9)
    expect(answer.network.coupling.converged).toBe(true)
    expect(answer.network.coupling.iterations).toBeGreaterThan(1)
    expect(answer.network.coupling.change).toBeLessThan(answer.network.coupling.tolerance)
  })

  it("charges the water feed μd/μc of the resistance the single-phase model gave it (which used the oil's viscosity)", () => {
    const feed = channel('water-feed')
    const muOil = answer.network.liquid.viscosity.value
    const singlePhase = rectangularResistance(
      muOil as PascalSeconds,
      2300e-6 as Metres,
      50e-6 as Metres,
      50e-6 as Metres,
    )
    expect(relative(feed.resistance.value / singlePhase, feed.viscosity.value / muOil)).toBeLessThan(1e-12)
    expect(feed.viscosity.value / muOil).toBeLessThan(0.5)
    expect(SINGLE_PHASE.id).toBe('single-phase-continuous-viscosity')
  })

  it("adds the drops' pressure in the channels after the junction, n drops × Bretherton each (Fuerstman et al. 2007)", () => {
    const out = channel('drops-out')
    const f = answer.junctions[0]!.forecast!
    const q = out.flow.value
    const area = 100e-6 * 50e-6
    const count = (f.frequency.value * 3300e-6 * area) / q
    const expected =
      count *
      confinedDropPressure(answer.network.liquid.viscosity.value, q / area, f.inputs.interfacialTension.value, 25e-6)
    expect(relative(out.dropletPressureDrop.value, expected)).toBeLessThan(1e-5)
    expect(out.dropletShare).toBeGreaterThan(0)
    expect(out.dropletShare).toBeLessThan(1)
    expect(channel('oil-feed').dropletPressureDrop.value).toBe(0)
  })

  it("reports every inlet's pressure and flow whatever its mode", () => {
    const oil = answer.network.inlets.find(i => i.port === 'oil-in')!
    expect(oil.mode).toBe('flow')
    expect(relative(oil.flow.value, 10 * UL_PER_MIN)).toBeLessThan(1e-12)
    expect(oil.pressure.value).toBeGreaterThan(node('tj-1:centre'))
    const water = answer.network.inlets.find(i => i.port === 'water-in')!
    expect(water.pressure.value).toBe(8000)
    expect(water.flow.value).toBeGreaterThan(0)
  })

  it('gives the pressure window of the water inlet: drops from the entry barrier to jetting, the set point inside', () => {
    const [window] = answer.network.operatingWindow
    expect(window!.port).toBe('water-in')
    expect(window!.from.value).toBeLessThan(8000)
    expect(window!.to.value).toBeGreaterThan(8000)
    expect(['jetting', 'continuous-backflow']).toContain(window!.limitedBy)
    // Just past the upper edge, the junction's own forecast says jetting (or the oil flows back).
    const beyond = forecastDocument(withWater((window!.to.value * 1.15) / 100))
    const f = beyond.junctions[0]!.forecast
    expect(f === null || f.regime.value === 'jetting').toBe(true)
  })
})

describe('entry barrier: no droplets until ≈ X mbar', () => {
  const low = forecastDocument(withWater(20))

  it('below its barrier the junction makes no drops, and the answer names the pressure where they start', () => {
    const tj = low.junctions[0]!
    expect(tj.forecast).toBeNull()
    expect(tj.entry!.state).not.toBe('open')
    const start = tj.entry!.dropsFrom!.value
    const warning = low.warnings.find(w => w.code === 'below-entry-barrier')!
    expect(warning.message).toContain(`until inlet "water-in" reaches ≈ ${(start / 100).toPrecision(3)} mbar`)
    // The barrier at the 50 µm × 50 µm arm, θ = 150°: the continuous phase keeps the corners (30° < 45°), so the
    // square-duct closed form 2[cos θw + √(π/4 − θw + sin θw cos θw)] γ/a, θw = 30° (Ma, Mason & Morrow 1996).
    const gamma = forecastDocument(withWater(80)).junctions[0]!.forecast!.inputs.interfacialTension.value
    const t = Math.PI / 6
    expect(
      relative(
        tj.entry!.barrier.value,
        (2 * (Math.cos(t) + Math.sqrt(Math.PI / 4 - t + Math.sin(t) * Math.cos(t))) * gamma) / 50e-6,
      ),
    ).toBeLessThan(1e-9)
    // 1 mbar above the start drops form; 1 mbar below they do not.
    expect(forecastDocument(withWater(start / 100 + 1)).junctions[0]!.forecast).not.toBeNull()
    expect(forecastDocument(withWater(start / 100 - 1)).junctions[0]!.forecast).toBeNull()
  })
})

describe('coupling fallback', () => {
  it('when the iteration stops before the tolerance, the answer says so and marks flows invalid (never a silent number)', () => {
    const answer = forecastDocument(withWater(80), undefined, { maxCouplingIterations: 2 })
    expect(answer.network.coupling.converged).toBe(false)
    expect(answer.warnings.map(w => w.code)).toContain('two-phase-not-converged')
    expect(answer.network.inlets.every(i => !i.flow.valid)).toBe(true)
  })
})

describe('droplet-resistance laws', () => {
  it('Bretherton 1961 (J. Fluid Mech. 10, 166): Δp r/γ = 4.52 (3Ca)^(2/3); Ca = 1e-3 → 0.0940', () => {
    // μ U/γ = 1e-3 with μ = 1 mPa·s, U = 5 mm/s, γ = 5 mN/m; r = 1 so Δp/γ is the dimensionless drop.
    expect(confinedDropPressure(1e-3, 5e-3, 5e-3, 1) / 5e-3).toBeCloseTo(4.52 * Math.cbrt(3e-3 ** 2), 12)
    expect(confinedDropPressure(1e-3, 5e-3, 5e-3, 1) / 5e-3).toBeCloseTo(0.094, 3)
  })
  it('Taylor 1932 dilute emulsion; rigid-sphere limit λ → ∞ is Einstein 1906 (1 + 2.5φ), bubbles λ = 0 give 1 + φ', () => {
    expect(taylorRelativeViscosity(0.05, 1e12)).toBeCloseTo(1 + 2.5 * 0.05, 9)
    expect(taylorRelativeViscosity(0.05, 0)).toBeCloseTo(1.05, 12)
    expect(taylorRelativeViscosity(0.05, 1)).toBeCloseTo(1 + (0.05 * 3.5) / 2, 12)
  })
})
