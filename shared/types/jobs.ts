/** A background job of the lab that failed for good, or failed and waits for its next try (the admin view). */
export interface FailedJob {
  id: string
  name: string
  state: 'failed' | 'retry'
  /** Runs so far, the failed ones included. */
  attempts: number
  /** Runs allowed after the first. */
  retryLimit: number
  error: string
  createdAt: string
  /** When it failed for good (null while it waits for a retry). */
  failedAt: string | null
}

/** What each kind of job does, in people's words (a job without a line here shows its name). */
export const JOB_LABELS: Record<string, string> = {
  'mail.send': 'Send an e-mail',
  'micrograph.measure': 'Measure the droplets of a micrograph',
  'revision.summary': "Forecast and check a large chip's revision",
  'as-built.summary': 'Forecast and check a large as-built chip',
  'mask.dxf': 'Make a mask DXF',
}
