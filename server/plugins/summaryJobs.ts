// A large chip's revision summary as a background job (server/services/summaryJob.ts): any instance takes it.
import { SUMMARY_JOB, summaryJob } from '../services/summaryJob'
import { defineJob } from '../utils/jobs'

export default defineNitroPlugin(() => {
  defineJob(SUMMARY_JOB, summaryJob, { retryLimit: 2, retryDelay: 5, expireInSeconds: 600, concurrency: 1 })
})
