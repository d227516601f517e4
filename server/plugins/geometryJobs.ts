// Long geometry as background jobs, run by any instance: large chips' revision and as-built summaries
// (server/services/summaryJob.ts, asBuiltJob.ts) and mask DXF files (maskExports.ts).
import { AS_BUILT_JOB } from '../services/asBuilt'
import { asBuiltSummaryJob } from '../services/asBuiltJob'
import { MASK_JOB, maskJob } from '../services/maskExports'
import { SUMMARY_JOB, summaryJob } from '../services/summaryJob'
import { defineJob } from '../utils/jobs'

export default defineNitroPlugin(() => {
  defineJob(SUMMARY_JOB, summaryJob, { retryLimit: 2, retryDelay: 5, expireInSeconds: 600, concurrency: 1 })
  // Retried while the drawn revision's own summary is still pending: about 3, 6, 12, 24, 48 s apart.
  defineJob(AS_BUILT_JOB, asBuiltSummaryJob, { retryLimit: 5, retryDelay: 3, expireInSeconds: 600, concurrency: 1 })
  // A DXF that cannot be made (a 400 from the mask export) fails the same way again: one retry for a lost worker.
  defineJob(MASK_JOB, maskJob, { retryLimit: 1, retryDelay: 2, expireInSeconds: 600, concurrency: 1 })
})
