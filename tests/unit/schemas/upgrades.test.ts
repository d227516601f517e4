import { describe, expect, it } from 'vitest'
import { CHIP_DOCUMENT_VERSION, parseChipDocument, upgradeChipDocument, upgradeSteps } from '#shared/schemas/chip'
import { loadDocumentFixture } from './load-fixture'

// Source: the versioning contract in shared/schemas/chip/README.md (one step per version, applied in order).
function asV0(): Record<string, any> {
  const v1 = loadDocumentFixture('t-junction-basic.json')
  const { version: _v, units: _u, operatingPoints, activeOperatingPoint: _a, ...rest } = v1
  const ports = rest.ports.map(({ punchDiameter, ...p }: Record<string, unknown>) => ({
    ...p,
    diameter: punchDiameter,
  }))
  const { id: _id, name: _n, ...liquids } = operatingPoints[0]
  return { ...rest, ports, liquids }
}

describe('chip document upgrades', () => {
  it('has one step per version below the current one', () => {
    expect(upgradeSteps).toHaveLength(CHIP_DOCUMENT_VERSION)
  })
  it('upgrades a v0 draft (no version field) to a valid current document', () => {
    const r = parseChipDocument(asV0())
    expect(r.ok).toBe(true)
    if (!r.ok) return
    expect(r.upgradedFrom).toBe(0)
    expect(r.document.units).toBe('um')
    expect(r.document.ports.map(p => p.punchDiameter)).toEqual([750, 750, 1000])
    expect(r.document.operatingPoints[0]?.inlets).toHaveLength(2)
    expect(r.document.activeOperatingPoint).toBe('op-1')
  })
  it('leaves a current document untouched', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    const r = upgradeChipDocument(doc, CHIP_DOCUMENT_VERSION)
    expect(r.ok && r.document).toEqual(doc)
  })
  it('rejects a version that is not a whole number', () => {
    const r = upgradeChipDocument({ version: 0.5 }, CHIP_DOCUMENT_VERSION)
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.message).toMatch(/Document version must be a whole number/)
  })
})
