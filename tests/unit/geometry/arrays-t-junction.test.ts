import { describe, expect, it } from 'vitest'
import { parseChipDocument } from '#shared/schemas/chip'
import {
  ladderNonUniformity,
  planParallelChip,
  planTJunctionChip,
  rectResistancePerViscosity,
  waferFor,
} from '~~/geometry/arrays'
import { buildOutlines } from '~~/geometry/outlines'
import { BUILT_IN_PROCESSES, checkDesignRules } from '~~/geometry/rules'

// Sources: geometry/arrays/resistance.ts (Bruus's rectangular-channel approximation; ladder criterion derived
// from Kirchhoff's laws); wafer diameters SEMI M1, 5 mm edge exclusion common practice (geometry/arrays/wafer.ts).
describe('parallel T-junction chip generator', () => {
  const plan = planTJunctionChip({ junctions: 12, junctionsPerBank: 6 })
  const doc = plan.document

  it('builds a document the schema accepts, with N T-junction components', () => {
    expect(parseChipDocument(JSON.parse(JSON.stringify(doc))).ok).toBe(true)
    expect(doc.components.filter(c => c.kind === 't-junction')).toHaveLength(12)
    expect(plan.banks).toBe(2)
    expect(plan.warnings).toEqual([])
  })
  it('has no error or warning findings under either built-in process (default parameters)', () => {
    for (const process of BUILT_IN_PROCESSES) {
      for (const d of [doc, planTJunctionChip({ junctions: 8 }).document]) {
        expect(checkDesignRules(d, process).filter(f => f.severity !== 'info')).toEqual([])
      }
    }
  })
  it('every junction is its own connected part on the junction layer, each manifold one part on the deep layer', () => {
    const o = buildOutlines(doc)
    expect(o.layers.find(l => l.layerId === 'junction')!.polygons).toHaveLength(12 + 2) // + 2 alignment crosses
    expect(o.layers.find(l => l.layerId === 'deep')!.polygons).toHaveLength(2 * 2 + 2) // 2 manifolds per bank
  })
  it('sizes both manifolds to the non-uniformity target from the drawn channel widths and lengths', () => {
    const junctionLayer = doc.layers.find(l => l.id === 'junction')!.depth
    const deep = doc.layers.find(l => l.id === 'deep')!.depth
    const channel = (id: string) => doc.channels.find(c => c.id === id)!
    const length = (id: string) =>
      channel(id)
        .points.slice(1)
        .reduce((s, p, i) => s + Math.hypot(p.x - channel(id).points[i]!.x, p.y - channel(id).points[i]!.y), 0)
    const tj = doc.components.find(c => c.id === 'b0-tj0')!
    if (tj.kind !== 't-junction') throw new Error('expected a T-junction')
    const pitch = length('b0-cm0')
    // Continuous path: branch + main arms + outlet channel; dispersed path: branch + side arm.
    const rc = rectResistancePerViscosity(
      tj.mainWidth,
      junctionLayer,
      length('b0-cb0') + 2 * tj.armLength + length('b0-ob0'),
    )
    const rd = rectResistancePerViscosity(tj.inletWidth, junctionLayer, length('b0-db0') + tj.armLength)
    const dc = ladderNonUniformity(rectResistancePerViscosity(channel('b0-cm0').width, deep, pitch), rc, 6)
    const dd = ladderNonUniformity(rectResistancePerViscosity(channel('b0-dm0').width, deep, pitch), rd, 6)
    expect(dc).toBeLessThanOrEqual(0.01)
    expect(dd).toBeLessThanOrEqual(0.01)
    expect(dc).toBeCloseTo(plan.continuous.nonUniformity, 9)
    // Narrowest that meets it: 2 µm narrower misses the target.
    expect(
      ladderNonUniformity(rectResistancePerViscosity(channel('b0-cm0').width - 2, deep, pitch), rc, 6),
    ).toBeGreaterThan(0.01)
  })
  it('lengthens the branches when the widest allowed manifold cannot meet the target', () => {
    const wide = planTJunctionChip({ junctions: 16, junctionsPerBank: 16, maxManifoldWidth: 1000 })
    expect(wide.continuous.branchLength).toBeGreaterThan(2000)
    expect(wide.continuous.nonUniformity).toBeLessThanOrEqual(0.01)
    expect(checkDesignRules(wide.document, BUILT_IN_PROCESSES[0]!).filter(f => f.severity !== 'info')).toEqual([])
  })
})

describe('chip size and wafer', () => {
  it('a centred chip fits when its diagonal is within the wafer minus twice the 5 mm edge exclusion', () => {
    expect(waferFor(60000, 65000).diameterMm).toBe(100) // diagonal 88.5 mm ≤ 90 mm
    expect(waferFor(60000, 70000).diameterMm).toBe(150) // diagonal 92.2 mm > 90 mm, ≤ 140 mm
    expect(waferFor(400000, 10000).diameterMm).toBeNull()
  })
  it('the 4,096-nozzle step chip lays its banks out in rows and fits a 100 mm wafer', () => {
    const p = planParallelChip({ nozzles: 4096 })
    expect(p.chip.rows).toBeGreaterThan(1)
    expect(p.chip.wafer.diameterMm).toBe(100)
    expect(Math.hypot(p.chip.width, p.chip.height) / 1000).toBeLessThanOrEqual(90)
    expect(p.warnings).toEqual([])
  })
  it('a chip too large for 100 mm names the wafer it needs, in its name and a warning', () => {
    const p = planParallelChip({ nozzles: 8192 }) // 16,384 is over the document's piece limit (shared/schemas/chip/limits.ts)
    expect(p.chip.wafer.diameterMm).toBeGreaterThan(100)
    expect(p.document.name).toContain(`needs a ${p.chip.wafer.diameterMm} mm wafer`)
    expect(p.warnings[0]).toMatch(/does not fit a 100 mm wafer/)
  })
})

describe('unbounded plans (benchmarks only)', () => {
  it('are the same document the schema accepts, only unchecked', () => {
    // The 16,384-nozzle benchmark chip is over the piece limit; below it, skipping the check changes nothing.
    const checked = planParallelChip({ nozzles: 256 }).document
    const unchecked = planParallelChip({ nozzles: 256, unbounded: true }).document
    expect(unchecked).toEqual(checked)
    expect(() => planParallelChip({ nozzles: 16384 })).toThrow(/at most 40 000 pieces/)
    expect(planParallelChip({ nozzles: 16384, unbounded: true }).document.components.length).toBeGreaterThanOrEqual(
      16384,
    )
  })
})
