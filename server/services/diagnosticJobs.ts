// Two diagnostic jobs, defined only when DW_DIAGNOSTIC_JOBS=1 (the test servers set it), so a test can watch the
// queue itself: "diagnostic.echo" waits `ms` and answers which instance ran it (its PORT); "diagnostic.fail" always
// throws `message`, to see the retries, the back-off, the dead-letter copy and the lab's failed-jobs view.
import { setTimeout as sleep } from 'node:timers/promises'
import { useConfig } from '../utils/config'
import { defineJob } from '../utils/jobs'

export interface EchoData {
  labId?: string
  ms?: number
  marker: string
}
export interface FailData {
  labId?: string
  message: string
  marker: string
}

export function defineDiagnosticJobs() {
  defineJob<EchoData>(
    'diagnostic.echo',
    async data => {
      await sleep(Math.min(Math.max(data.ms ?? 0, 0), 5000))
      return { instance: useConfig().listen.port, marker: data.marker }
    },
    { retryLimit: 0, deadLetter: false, concurrency: 2 },
  )
  defineJob<FailData>(
    'diagnostic.fail',
    async data => {
      throw new Error(data.message)
    },
    { retryLimit: 2, retryDelay: 1, retryBackoff: true },
  )
}
