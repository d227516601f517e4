// Bench runs forecast on the chip that was really made: the latest as-built report when there is one (unless the run
// asks for the chip as drawn), with the sizes measured at the bench on the junction. Real server and PostgreSQL.
import { describe, expect, it } from 'vitest'
import { labWithDesign } from '../support/designs'
import { releasedOrder } from '../support/orders'

const typed = (extra: Record<string, unknown> = {}) => ({
  source: 'typed',
  values: [48, 50, 52],
  operatingPointId: 'op-1',
  ...extra,
})

describe('bench runs on the as-built chip', () => {
  it('forecast on the as-built chip by default once one is reported, as drawn on request, and say which', async () => {
    const c = await labWithDesign()
    const { revisionId } = await releasedOrder(c)
    const runs = `/api/labs/${c.lab.id}/revisions/${revisionId}/bench-runs`

    const drawn = await c.as.experimenter.post(runs, typed())
    expect(drawn.status, JSON.stringify(drawn.json)).toBe(201)
    expect(drawn.json.predicted.chip).toEqual({
      basis: 'as-drawn',
      asBuiltId: null,
      reportedAt: null,
      benchSizes: false,
    })
    expect(drawn.json.predicted.depthUm).toBeCloseTo(50, 9)
    expect((await c.as.experimenter.get(runs)).json.asBuilt).toBeNull()
    // Asking for an as-built chip that nobody reported is refused, naming why; nothing is recorded.
    const none = await c.as.experimenter.post(runs, typed({ chip: 'as-built' }))
    expect(none.status).toBe(400)
    expect(none.json.data.issues[0].path).toBe('chip')
    expect(none.json.message).toMatch(/No as-built report has been recorded/)
    expect((await c.as.experimenter.get(runs)).json.runs).toHaveLength(1)

    // The fab measured the 50 µm layer at 40 µm.
    const report = await c.as.fabricator.post(`/api/labs/${c.lab.id}/revisions/${revisionId}/as-built`, {
      depths: [{ layerId: 'ch50', depthUm: 40 }],
    })
    expect(report.status, JSON.stringify(report.json)).toBe(201)
    const list = (await c.as.experimenter.get(runs)).json
    expect(list.asBuilt).toMatchObject({ id: report.json.asBuiltId, depths: [{ layerId: 'ch50', depthUm: 40 }] })
    expect(typeof list.asBuilt.recordedByName).toBe('string')

    const built = await c.as.experimenter.post(runs, typed())
    expect(built.status, JSON.stringify(built.json)).toBe(201)
    expect(built.json.predicted.chip).toMatchObject({
      basis: 'as-built',
      asBuiltId: report.json.asBuiltId,
      benchSizes: false,
    })
    expect(built.json.predicted.depthUm).toBeCloseTo(40, 9)
    // A squeezing plug fills the channel's cross-section: a shallower channel makes a smaller drop at the same flows.
    expect(built.json.predicted.diameterUm).toBeLessThan(drawn.json.predicted.diameterUm)

    const asDrawn = await c.as.experimenter.post(runs, typed({ chip: 'as-drawn' }))
    expect(asDrawn.json.predicted.chip.basis).toBe('as-drawn')
    expect(asDrawn.json.predicted.diameterUm).toBeCloseTo(drawn.json.predicted.diameterUm, 9)
  }, 60_000)

  it('applies the sizes measured at the bench to the junction and its layer, and names what it cannot apply', async () => {
    const c = await labWithDesign()
    const runs = `/api/labs/${c.lab.id}/revisions/${c.revisionId}/bench-runs`
    const plain = (await c.as.experimenter.post(runs, typed())).json
    const measured = await c.as.experimenter.post(runs, typed({ asBuilt: { mainWidthUm: 95, depthUm: 45 } }))
    expect(measured.status, JSON.stringify(measured.json)).toBe(201)
    expect(measured.json.predicted.chip).toMatchObject({ basis: 'as-drawn', benchSizes: true })
    expect(measured.json.predicted.mainWidthUm).toBeCloseTo(95, 9)
    expect(measured.json.predicted.depthUm).toBeCloseTo(45, 9)
    expect(measured.json.predicted.diameterUm).not.toBeCloseTo(plain.predicted.diameterUm, 3)
    expect(measured.json.asBuilt).toEqual({ mainWidthUm: 95, depthUm: 45 })

    const unknown = await c.as.experimenter.post(runs, typed({ junctionId: 'nope', asBuilt: { depthUm: 45 } }))
    expect(unknown.status).toBe(400)
    expect(unknown.json.data.issues[0]).toEqual({ path: 'junctionId', message: 'No junction "nope" on this chip' })
    const negative = await c.as.experimenter.post(runs, typed({ asBuilt: { depthUm: -2 } }))
    expect(negative.status).toBe(400)
    expect(negative.json.message).toMatch(/As-built depth must be > 0 µm/)
    expect((await c.as.experimenter.get(runs)).json.runs).toHaveLength(2)
  }, 60_000)
})
