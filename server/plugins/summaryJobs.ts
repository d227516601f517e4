// Large chips' summaries as background jobs (server/services/summaryJob.ts, asBuiltJob.ts): any instance takes them.
import { AS_BUILT_JOB } from '../services/asBuilt'
import { asBuiltSummaryJob } from '../services/asBuiltJob'
import { SUMMARY_JOB, summaryJob } from '../services/summaryJob'
import { defineJob } from '../utils/jobs'

export default defineNitroPlugin(() => {
  defineJob(SUMMARY_JOB, summaryJob, { retryLimit: 2, retryDelay: 5, expireInSeconds: 600, concurrency: 1 })
  // Retried while the drawn revision's own summary is still pending: about 3, 6, 12, 24, 48 s apart.
  defineJob(AS_BUILT_JOB, asBuiltSummaryJob, { retryLimit: 5, retryDelay: 3, expireInSeconds: 600, concurrency: 1 })
})
