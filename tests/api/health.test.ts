import { describe, expect, it } from 'vitest'
import { ApiClient } from '../support/api'
import { labWithDesign } from '../support/designs'

describe('the built server', () => {
  it('answers the liveness probe without a session and runs revision summaries in its worker thread', async () => {
    const res = await new ApiClient().get('/api/health')
    expect(res.status).toBe(200)
    expect(res.json).toEqual({ ok: true, database: 'ok', summaryWorker: true })
  })

  it("stores the worker's summary with a saved revision (forecast and rule counts)", async () => {
    const { lab, as, revisionId } = await labWithDesign()
    const revision = (await as.designer.get(`/api/labs/${lab.id}/revisions/${revisionId}`)).json
    expect(revision.summary.junctionKinds).toEqual(['t-junction'])
    expect(revision.summary.forecastError).toBeNull()
    expect(revision.summary.junctions[0]).toMatchObject({ id: 'tj-1', kind: 't-junction' })
    expect(revision.summary.findings.errors).toBe(0)
  })
})
