// Reads what arrived at the local fake SMTP server (scripts/fake-smtp.ts keeps each message in .data/mail/).
import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { join, resolve } from 'node:path'

export interface ArrivedMail {
  messageId: string | null
  from: string
  to: string[]
  subject: string
  text: string
  html: string | null
  date: string
}

const mailDir = () => resolve(process.env.DW_MAIL_DIR || join(process.cwd(), '.data/mail'))

export function mailTo(address: string): ArrivedMail[] {
  const dir = mailDir()
  if (!existsSync(dir)) return []
  const wanted = address.toLowerCase()
  return readdirSync(dir)
    .filter(n => n.endsWith('.json') && !n.startsWith('.'))
    .sort()
    .map(n => JSON.parse(readFileSync(join(dir, n), 'utf8')) as ArrivedMail)
    .filter(m => m.to.includes(wanted))
}

/**
 * The first message to `address` (the nth with `index`), polling until it arrives or `timeoutMs` passes. Mail goes
 * out one at a time, in order (mail.send, concurrency 1): behind a burst of the other tests' e-mail (≈ 170 a minute
 * in CI) a message can take over 10 s.
 */
export async function waitForMail(address: string, { timeoutMs = 20_000, index = 0 } = {}): Promise<ArrivedMail> {
  const until = Date.now() + timeoutMs
  for (;;) {
    const found = mailTo(address)[index]
    if (found) return found
    if (Date.now() > until)
      throw new Error(
        `no e-mail to ${address} arrived at the fake SMTP within ${timeoutMs} ms (looked in ${mailDir()})`,
      )
    await new Promise(r => setTimeout(r, 100))
  }
}

/** The invitation link in a message's text, as an address path (`/invitations/<token>`) and the token. */
export function invitationLink(mail: ArrivedMail): { url: string; path: string; token: string } {
  const m = /(https?:\/\/[^\s]+\/invitations\/([A-Za-z0-9_-]{43}))/.exec(mail.text)
  if (!m) throw new Error(`no invitation link in:\n${mail.text}`)
  return { url: m[1]!, path: new URL(m[1]!).pathname, token: m[2]! }
}

/** The password reset link in a message's text, as an address path (`/reset-password/<token>`) and the token. */
export function resetLink(mail: ArrivedMail): { url: string; path: string; token: string } {
  const m = /(https?:\/\/[^\s]+\/reset-password\/([A-Za-z0-9_-]{43}))/.exec(mail.text)
  if (!m) throw new Error(`no reset link in:\n${mail.text}`)
  return { url: m[1]!, path: new URL(m[1]!).pathname, token: m[2]! }
}
