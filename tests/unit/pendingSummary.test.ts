// A large chip's summary before and after its background job: the pending one carries only what costs nothing
// (kinds, counts, process), and one whose job gave up is finished, says why, and never reads as "no errors".
import { describe, expect, it } from 'vitest'
import { planParallelChip } from '../../geometry/arrays'
import { givenUpSummary, pendingSummary, summarizeRevision } from '../../server/services/revisionSummary'

const doc = planParallelChip({ nozzles: 16 }).document as never

describe('pending and given-up revision summaries', () => {
  it('a pending summary has the cheap parts of the finished one, and no results', () => {
    const done = summarizeRevision(doc, 'film-mask-soft-litho')
    const pending = pendingSummary(doc, 'film-mask-soft-litho')
    expect(pending.pending).toBe(true)
    expect(pending.junctions).toEqual([])
    expect(pending.inlets).toEqual([])
    for (const key of ['junctionKinds', 'counts', 'processId', 'library'] as const)
      expect(pending[key]).toEqual(done[key])
    expect(done.pending).toBeUndefined()
    expect(done.junctions.length).toBeGreaterThanOrEqual(16)
  })

  it('a given-up summary is finished, names the reason and counts one rule error', () => {
    const given = givenUpSummary(pendingSummary(doc, 'film-mask-soft-litho'), 'revision', new Error('took too long'))
    expect(given.pending).toBeUndefined()
    expect('pending' in given).toBe(false)
    expect(given.forecastError).toBe('No forecast or rule check for this revision: took too long')
    expect(given.findings.errors).toBe(1)
  })
})
