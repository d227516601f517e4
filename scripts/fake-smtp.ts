// A local stand-in for an SMTP provider, for `npm start`, `npm run dev` and `npm test`: it accepts every message on
// 127.0.0.1 and keeps each one as a JSON file in .data/mail/ (or DW_MAIL_DIR), where the tests and the outbox page
// read them. It never relays anything anywhere.
//
//   npx tsx scripts/fake-smtp.ts [port]        (port: DW_SMTP_PORT, else the one scripts/smtp.sh derives)
//
// Recipients whose local part starts with `flaky-` are refused once with a temporary 451, so that the
// retry path of the mail worker can be watched end to end.
import { randomUUID } from 'node:crypto'
import { mkdirSync, renameSync, writeFileSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { simpleParser, type AddressObject } from 'mailparser'
import { SMTPServer } from 'smtp-server'

export interface KeptMessage {
  id: string
  messageId: string | null
  from: string
  to: string[]
  subject: string
  text: string
  html: string | null
  date: string
}

export const FAKE_SMTP_BANNER = 'Dropwright local fake SMTP (keeps mail, never relays)'

const port = Number(process.argv[2] ?? process.env.DW_SMTP_PORT)
if (!Number.isInteger(port) || port <= 0) {
  console.error('usage: tsx scripts/fake-smtp.ts PORT (or set DW_SMTP_PORT)')
  process.exit(64)
}
const dir = resolve(process.env.DW_MAIL_DIR ?? join(process.cwd(), '.data/mail'))
mkdirSync(dir, { recursive: true })

const refusedOnce = new Set<string>()
const addresses = (a: AddressObject | AddressObject[] | undefined) =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap(o => o.value.map(v => v.address ?? '')).filter(Boolean)

const server = new SMTPServer({
  banner: FAKE_SMTP_BANNER,
  authOptional: true,
  disabledCommands: ['STARTTLS', 'AUTH'],
  disableReverseLookup: true,
  size: 5 * 1024 * 1024,
  logger: false,
  onRcptTo(address, _session, callback) {
    const to = address.address.toLowerCase()
    if (to.startsWith('flaky-') && !refusedOnce.has(to)) {
      refusedOnce.add(to)
      const error = Object.assign(
        new Error('Mailbox busy, try again later (fake SMTP: flaky- addresses are refused once)'),
        { responseCode: 451 },
      )
      return callback(error)
    }
    callback()
  },
  onData(stream, session, callback) {
    simpleParser(stream).then(
      mail => {
        const envelopeTo = session.envelope.rcptTo.map(r => r.address.toLowerCase())
        const kept: KeptMessage = {
          id: randomUUID(),
          messageId: mail.messageId ?? null,
          from: addresses(mail.from)[0] ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
          to: envelopeTo.length ? envelopeTo : addresses(mail.to).map(a => a.toLowerCase()),
          subject: mail.subject ?? '',
          text: mail.text ?? '',
          html: typeof mail.html === 'string' ? mail.html : null,
          date: new Date().toISOString(),
        }
        // Written under a temporary name, then renamed: readers never see half a file.
        const name = `${kept.date.replace(/[:.]/g, '-')}-${kept.id.slice(0, 8)}.json`
        writeFileSync(join(dir, `.${name}.tmp`), JSON.stringify(kept, null, 2))
        renameSync(join(dir, `.${name}.tmp`), join(dir, name))
        console.log(`[fake-smtp] kept "${kept.subject}" for ${kept.to.join(', ')}`)
        callback()
      },
      (error: Error) => callback(error),
    )
  },
})

server.on('error', error => {
  console.error(`[fake-smtp] ${error.message}`)
  process.exit(1)
})
server.listen(port, '127.0.0.1', () => {
  console.log(`[fake-smtp] listening on 127.0.0.1:${port}, keeping mail in ${dir}`)
})
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.close(() => process.exit(0)))
