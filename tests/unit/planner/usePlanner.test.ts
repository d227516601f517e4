// The planner composable through its worker: only the latest request's answer is kept, however late an older one
// arrives.
import { describe, expect, it } from 'vitest'
import { effectScope } from 'vue'
import { ChannelWorker } from '../../support/channelWorker'
import { usePlanner } from '../../../composables/usePlanner'
import type { PlanJob, PlanResult } from '../../../utils/plannerRun'

const wait = (ms: number) => new Promise(r => setTimeout(r, ms))

/** A stand-in for the browser's Worker: answers each job after the delay it names, with the tag it names. */
class FakePlannerWorker extends ChannelWorker {
  constructor() {
    const plan = async (job: PlanJob): Promise<PlanResult> => {
      const r = job.request as { delayMs: number; tag: string }
      await wait(r.delayMs)
      return { answer: { tag: r.tag } as unknown as PlanResult['answer'], error: null, issues: [] }
    }
    super({ plan })
  }
}

describe('usePlanner with a worker', () => {
  it('an older request answered after a newer one does not overwrite it', async () => {
    const g = globalThis as { Worker?: unknown }
    const before = g.Worker
    g.Worker = FakePlannerWorker
    try {
      const scope = effectScope()
      const planner = scope.run(() => usePlanner())!
      planner.plan({ delayMs: 120, tag: 'older' })
      planner.plan({ delayMs: 5, tag: 'newer' })
      await wait(60)
      expect(planner.answer.value).toEqual({ tag: 'newer' })
      expect(planner.busy.value).toBe(false)
      await wait(150) // the older answer has arrived by now
      expect(planner.answer.value).toEqual({ tag: 'newer' })
      scope.stop()
    } finally {
      g.Worker = before
    }
  })
})
