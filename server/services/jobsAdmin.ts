// The lab admin's view of background jobs: the lab's jobs that failed (or failed and wait for a retry). Only jobs
// whose data carries the caller's labId are listed; another lab's are never seen.
import type { FailedJob } from '#shared/types/jobs'
import type { LabCaller } from '../utils/access'
import { failedJobs } from '../utils/jobs'

export async function labFailedJobs(caller: LabCaller): Promise<{ jobs: FailedJob[] }> {
  return { jobs: await failedJobs(caller.lab.labId) }
}
