// Starts the e-mail worker with the server: sends what `queueMail` put in mail_outbox over SMTP_URL.
// Without SMTP_URL, mail stays queued (and is sent once a server with SMTP_URL runs). DW_MAIL_WORKER=0 turns the
// worker off on an instance that should not send.
import { onMailQueued } from '../services/mail'
import { dbOutboxStore, mailConfigFromEnv, smtpTransport, startMailWorker } from '../services/mailWorker'
import { useDb } from '../utils/db'

export default defineNitroPlugin((nitro) => {
  const url = process.env.SMTP_URL
  if (process.env.DW_MAIL_WORKER === '0') return
  if (!url) {
    console.warn('[mail] SMTP_URL is not set: e-mail is queued in mail_outbox but not sent')
    return
  }
  const worker = startMailWorker(dbOutboxStore(useDb()), smtpTransport(url), mailConfigFromEnv())
  onMailQueued(worker.kick)
  nitro.hooks.hook('close', async () => {
    onMailQueued(null)
    await worker.stop()
  })
})
