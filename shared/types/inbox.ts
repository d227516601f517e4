// The lab overview's answer (GET /api/labs/:labId/inbox).
export interface ReviewInbox {
  recentDesigns: Array<{
    designId: string
    name: string
    updatedAt: string
    latestNumber: number | null
    status: string | null
  }>
  /** Revisions in review that ask for the caller's verdict and have none from them since. */
  waitingForMe: Array<{
    revisionId: string
    designId: string
    designName: string
    number: number
    askedAt: string
    authorName: string
  }>
  /** Open comment threads the caller wrote in. */
  myOpenThreads: Array<{
    threadId: string
    revisionId: string
    designId: string
    designName: string
    number: number
    createdAt: string
  }>
}
