// The micrograph measurement as a background job (server/utils/jobs.ts): any instance takes it, a crash retries it.
import { MEASURE_JOB, measureMicrographJob } from '../services/benchMicrographs'
import { defineJob } from '../utils/jobs'

export default defineNitroPlugin(() => {
  defineJob(MEASURE_JOB, measureMicrographJob, { retryLimit: 2, retryDelay: 5, expireInSeconds: 600, concurrency: 1 })
})
