// Starts the background jobs (server/utils/jobs.ts) with the server: defines every job, makes its queue and, unless
// DW_JOBS_WORKER=0, runs its workers. Every instance on the same database shares the queue.
// A new kind of job: define it here (or in a plugin of its own with defineJob; that works after the start too).
import { defineMailJob, dbOutboxStore, mailJobConfig, smtpTransport, type MailTransport } from '../services/mailJob'
import { defineDiagnosticJobs } from '../services/diagnosticJobs'
import { useConfig } from '../utils/config'
import { useDb } from '../utils/db'
import { startJobs, stopJobs } from '../utils/jobs'

export default defineNitroPlugin(nitro => {
  // E-mail: sent over SMTP_URL. Without it (or with DW_MAIL_WORKER=0) mail stays queued on this instance and is
  // sent by one that has it.
  const { mail, jobs } = useConfig()
  const smtpUrl = mail.smtpUrl
  const sendsMail = Boolean(smtpUrl) && mail.send
  if (!smtpUrl)
    console.warn('[mail] SMTP_URL is not set: e-mail is queued in mail_outbox but not sent by this instance')
  let transport: MailTransport | null = null
  const lazyTransport: MailTransport = { send: mail => (transport ??= smtpTransport(smtpUrl!)).send(mail) }
  defineMailJob(dbOutboxStore(useDb()), lazyTransport, mailJobConfig(), { workHere: sendsMail })

  if (jobs.diagnostic) defineDiagnosticJobs()

  startJobs({ work: jobs.work }).catch((error: unknown) => {
    console.error(`[jobs] could not start: ${error instanceof Error ? error.message : String(error)}`)
  })
  nitro.hooks.hook('close', () => stopJobs())
})
