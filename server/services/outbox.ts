// The development outbox: the messages the local fake SMTP (scripts/fake-smtp.ts) kept in .data/mail/, shown to a
// lab's admins. Only there when the server runs with DW_DEV_OUTBOX=1 (the start, dev and test scripts set it
// together with the fake SMTP); 404 otherwise. A lab sees only messages queued for it: kept messages are matched
// to the lab's mail_outbox rows by their Message-ID.
import { readdir, readFile } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import { and, desc, eq, inArray, isNull } from 'drizzle-orm'
import { createError } from 'h3'
import { mailOutbox } from '../db/schema'
import { useConfig } from '../utils/config'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import type { KeptMail, LabOutbox } from '#shared/types/outbox'
import { outboxIdOf } from './mail'

const MAX_FILES = 500

export const outboxAvailable = () => useConfig().mail.devOutbox

export function requireOutbox() {
  if (!outboxAvailable())
    throw createError({
      statusCode: 404,
      statusMessage: 'Not Found',
      message: 'The outbox exists only with the local fake SMTP (npm start, npm run dev)',
    })
}

const mailDir = () => resolve(useConfig().mail.dir ?? join(process.cwd(), '.data/mail'))

interface KeptFile {
  messageId: string | null
  to: string[]
  from: string
  subject: string
  text: string
  html: string | null
  date: string
}

async function readKept(): Promise<Array<KeptFile & { outboxId: string }>> {
  const names = await readdir(mailDir()).catch(() => [] as string[])
  const newest = names
    .filter(n => n.endsWith('.json') && !n.startsWith('.'))
    .sort()
    .slice(-MAX_FILES)
    .reverse()
  const kept = await Promise.all(
    newest.map(async name => {
      try {
        const file = JSON.parse(await readFile(join(mailDir(), name), 'utf8')) as KeptFile
        const outboxId = outboxIdOf(file.messageId)
        return outboxId ? { ...file, outboxId } : null
      } catch {
        return null // a file being written or not ours
      }
    }),
  )
  return kept.filter(k => k !== null)
}

export async function labOutbox(caller: LabCaller): Promise<LabOutbox> {
  const kept = await readKept()
  const db = useDb()
  const ids = [...new Set(kept.map(k => k.outboxId))]
  const ours = ids.length
    ? await db
        .select({ id: mailOutbox.id, kind: mailOutbox.kind })
        .from(mailOutbox)
        .where(and(eq(mailOutbox.labId, caller.lab.labId), inArray(mailOutbox.id, ids)))
    : []
  const kindOf = new Map(ours.map(r => [r.id, r.kind]))
  const messages: KeptMail[] = kept
    .filter(k => kindOf.has(k.outboxId))
    .map(k => ({
      id: k.outboxId,
      kind: kindOf.get(k.outboxId)!,
      to: k.to,
      from: k.from,
      subject: k.subject,
      text: k.text,
      html: k.html,
      date: k.date,
    }))
  const waitingRows = await db
    .select()
    .from(mailOutbox)
    .where(and(eq(mailOutbox.labId, caller.lab.labId), isNull(mailOutbox.sentAt)))
    .orderBy(desc(mailOutbox.createdAt))
    .limit(100)
  return {
    messages,
    waiting: waitingRows.map(r => ({
      id: r.id,
      kind: r.kind,
      to: r.to,
      subject: r.subject,
      attempts: r.attempts,
      lastError: r.lastError,
      nextAttemptAt: r.nextAttemptAt.toISOString(),
    })),
  }
}
