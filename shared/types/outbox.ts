/** A message the local fake SMTP server received and kept (development and tests only). */
export interface KeptMail {
  id: string
  kind: string
  to: string[]
  from: string
  subject: string
  text: string
  html: string | null
  date: string
}

/** A queued message not sent yet: waiting for the worker, or failing and retried later. */
export interface WaitingMail {
  id: string
  kind: string
  to: string
  subject: string
  attempts: number
  lastError: string | null
  nextAttemptAt: string
}

export interface LabOutbox {
  messages: KeptMail[]
  waiting: WaitingMail[]
}
