import { describe, expect, it } from 'vitest'
import type { ChipDocument } from '#shared/schemas/chip'
import { planParallelChip } from '~~/geometry/arrays'
import { forecastDocument } from '#shared/physics/document'

/**
 * The generator's operating point names an explicit oil without an interfacial tension; the pair is not in the
 * library, so give one (3 mN/m, a fluorinated-surfactant value, typical value from memory) and a contact angle.
 */
function withTension(doc: ChipDocument): ChipDocument {
  return {
    ...doc,
    operatingPoints: doc.operatingPoints.map(op => ({ ...op, interfacialTensionMNPerM: 3, contactAngleDeg: 150 })),
  }
}

describe('document forecast of a generated parallel step-nozzle chip (geometry/arrays)', () => {
  const plan = planParallelChip({ nozzles: 96, nozzlesPerBank: 32 })
  const doc = withTension(plan.document)
  const answer = forecastDocument(doc)
  const nozzles = answer.junctions.filter(j => j.kind === 'step-nozzle')

  it('forecasts every nozzle from its own flow', () => {
    expect(nozzles).toHaveLength(96)
    for (const j of nozzles) {
      expect(j.forecast).not.toBeNull()
      const channel = answer.network.channels.find(c => c.id === `${j.id}/dispersed`)!
      expect(j.forecast!.inputs.flow.dispersed.value).toBe(channel.flow.value)
      expect(j.forecast!.inputs.junction.depth.value).toBeCloseTo(8e-6, 15) // the nozzle layer
    }
  })

  it('reports uniformity across the identical nozzles, and the nozzle flows add up to the dispersed inlets', () => {
    expect(answer.network.uniformity).toHaveLength(1)
    const set = answer.network.uniformity[0]!
    expect(set.count).toBe(96)
    expect(set.junctions).toEqual(nozzles.map(j => j.id))
    // The manifold was sized for a first-order spread ≤ 1 % (geometry/arrays/resistance.ts); the full network
    // (collector side included, nozzle drawn under half the manifold) lands within a few times that.
    expect(set.maxOverMin).toBeGreaterThan(1)
    expect(set.maxOverMin - 1).toBeLessThan(5 * plan.manifold.target)
    const supplied = answer.network.inlets
      .filter(i => i.port.endsWith('disp-in'))
      .reduce((sum, i) => sum + i.flow.value, 0)
    expect(Math.abs(set.mean * set.count - supplied) / supplied).toBeLessThan(1e-9)
    expect(answer.network.solver.name).toBe('pcg-envelope-cholesky')
  })

  it('the pressure-driven supply inlets need exactly their set pressure; the flow-driven ones report theirs', () => {
    for (const inlet of answer.network.inlets) {
      if (inlet.mode === 'pressure') expect(inlet.pressure.value).toBe(150 * 100)
      else expect(inlet.pressure.value).toBeGreaterThan(0)
    }
  })
})
