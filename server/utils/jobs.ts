// Background jobs on pg-boss (PostgreSQL-backed): every server instance started on the same database shares one
// queue, a job runs on exactly one of them, failed runs are retried with exponential back-off and, once their
// retries are spent, copied to the job's dead-letter queue and listed for the lab's admins (`failedJobs`).
//
//   defineJob(name, handler, options)   once per kind of work, from server/plugins/jobs.ts (or your own Nitro
//                                       plugin: defining after the start works too). Every instance defines every
//                                       job (that makes its queue); `workHere: false` keeps one from running it.
//   enqueueJob(name, data, { tx })      from a service; with `tx` the job row is written in that transaction, so
//                                       it exists exactly when the change that asks for it commits. Needs only the
//                                       queue in the database, not the definition in this process (scripts, tests).
//
// `data` is JSON. Give it a `labId` when the work belongs to a lab: the lab's failed-jobs view lists it by that.
import { and, desc, eq, inArray, sql, type SQL } from 'drizzle-orm'
import { integer, jsonb, pgSchema, text, timestamp, uuid } from 'drizzle-orm/pg-core'
import type pg from 'pg'
import PgBoss from 'pg-boss'
import type { FailedJob } from '#shared/types/jobs'
import { useConfig } from './config'
import { databaseUrl, useDb, usePool, type Db, type Tx } from './db'

export interface JobDefinitionOptions {
  /** Runs after the first failed one (pg-boss retryLimit). */
  retryLimit?: number
  /** Seconds before the first retry (a whole number, pg-boss retryDelay). */
  retryDelay?: number
  /** Each retry waits about twice as long as the one before (pg-boss retryBackoff, with jitter). */
  retryBackoff?: boolean
  /** Copy a job whose retries are spent to `<name>.dead` (true, the default), to a named queue, or nowhere (false). */
  deadLetter?: boolean | string
  /** A run that takes longer than this is failed (and retried). */
  expireInSeconds?: number
  /** Jobs of this kind that one instance runs at once. */
  concurrency?: number
  /**
   * pg-boss queue policy: 'standard' (default), 'short' (at most one waiting job per singletonKey), 'singleton'
   * (at most one running per key), 'stately' (one waiting and one running per key).
   */
  policy?: PgBoss.QueuePolicy
  /** Whether this instance runs the job (default true); its queue is made either way. */
  workHere?: boolean
}

export interface JobContext {
  id: string
  name: string
  retryCount: number
  retryLimit: number
}
export type JobHandler<T> = (data: T, job: JobContext) => Promise<unknown>

interface Definition {
  name: string
  handler: JobHandler<never>
  options: Required<Omit<JobDefinitionOptions, 'deadLetter'>> & { deadLetter: string | null }
}

/** A transaction to write the job in: a Drizzle transaction, a db, or a pg client inside a transaction. */
export type JobTransaction = Tx | Db | pg.PoolClient

export interface EnqueueOptions {
  tx?: JobTransaction
  /**
   * Deduplication key. On a 'short' or 'stately' job a second enqueue while one with the key waits returns null;
   * on a 'standard' one the key counts only together with `singletonSeconds` (one job per key per time slot).
   */
  singletonKey?: string
  singletonSeconds?: number
  retryLimit?: number
  /** Do not start before this time. */
  startAfter?: Date
}

const definitions = new Map<string, Definition>()
let boss: PgBoss | null = null
let starting: Promise<PgBoss> | null = null
let working = false
const queuesReady = new Map<string, Promise<void>>()

/** How often an idle instance looks for new jobs (pg-boss allows 0.5 s at least). */
const pollSeconds = () => useConfig().jobs.pollSeconds

export function defineJob<T extends object>(
  name: string,
  handler: JobHandler<T>,
  options: JobDefinitionOptions = {},
): { name: string } {
  if (!/^[a-z][a-z0-9-]*(\.[a-z][a-z0-9-]*)*$/.test(name))
    throw new Error(`Job name "${name}" must be lower-case words joined by "." or "-" (e.g. "mail.send")`)
  if (definitions.has(name)) throw new Error(`Job "${name}" is defined twice: define each job once, in one module`)
  const deadLetter =
    options.deadLetter === false ? null : typeof options.deadLetter === 'string' ? options.deadLetter : `${name}.dead`
  const definition: Definition = {
    name,
    handler: handler as JobHandler<never>,
    options: {
      retryLimit: options.retryLimit ?? 3,
      retryDelay: Math.round(options.retryDelay ?? 5),
      retryBackoff: options.retryBackoff ?? true,
      expireInSeconds: options.expireInSeconds ?? 15 * 60,
      concurrency: options.concurrency ?? 1,
      policy: options.policy ?? 'standard',
      workHere: options.workHere ?? true,
      deadLetter,
    },
  }
  definitions.set(name, definition)
  // Defined after the start (a plugin that runs later): make its queue and worker now.
  const b = boss
  if (b)
    void ensureQueue(b, definition)
      .then(() => (working ? work(b, definition) : undefined))
      .catch(logProblem)
  return { name }
}

/** The names defined in this process (the health view and tests read it). */
export const definedJobs = () => [...definitions.keys()]

let lastProblem = ''
function logProblem(error: unknown) {
  // The database may be away for a moment (tests/api/database-down.test.ts): say so once, pg-boss keeps polling.
  const message = `[jobs] ${error instanceof Error ? error.message : String(error)}`
  if (message !== lastProblem) console.warn(message)
  lastProblem = message
}

function ensureQueue(b: PgBoss, d: Definition): Promise<void> {
  let ready = queuesReady.get(d.name)
  if (!ready) {
    ready = (async () => {
      if (d.options.deadLetter && !(await b.getQueue(d.options.deadLetter))) await b.createQueue(d.options.deadLetter)
      const queue = {
        name: d.name,
        policy: d.options.policy,
        retryLimit: d.options.retryLimit,
        retryDelay: d.options.retryDelay,
        retryBackoff: d.options.retryBackoff,
        expireInSeconds: d.options.expireInSeconds,
        ...(d.options.deadLetter ? { deadLetter: d.options.deadLetter } : {}),
      }
      // Several instances start together: creating a queue that another one just made is fine.
      if (await b.getQueue(d.name)) await b.updateQueue(d.name, queue)
      else
        await b.createQueue(d.name, queue).catch(async (error: unknown) => {
          if (!(await b.getQueue(d.name))) throw error
        })
    })()
    ready.catch(() => queuesReady.delete(d.name))
    queuesReady.set(d.name, ready)
  }
  return ready
}

const workerIds = new Map<string, string[]>()

async function work(b: PgBoss, d: Definition) {
  if (!d.options.workHere) return
  const ids: string[] = []
  for (let i = 0; i < d.options.concurrency; i++) {
    ids.push(
      await b.work<never>(
        d.name,
        { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: pollSeconds() },
        async ([job]) => {
          if (!job) return
          return d.handler(job.data, {
            id: job.id,
            name: job.name,
            retryCount: job.retryCount,
            retryLimit: job.retryLimit,
          })
        },
      ),
    )
  }
  workerIds.set(d.name, ids)
}

/** Starts pg-boss (installing or migrating its `pgboss` schema) and, unless `work` is false, the workers. */
export function startJobs({ work: runWorkers = true }: { work?: boolean } = {}): Promise<PgBoss> {
  if (starting) return starting
  starting = (async () => {
    const b = new PgBoss({
      connectionString: databaseUrl(),
      max: useConfig().jobs.pool,
      application_name: 'dropwright-jobs',
      // Failed jobs stay listed for the lab's admins for 14 days; finished ones are archived after a day.
      archiveCompletedAfterSeconds: 24 * 3600,
      archiveFailedAfterSeconds: 14 * 24 * 3600,
    })
    b.on('error', logProblem)
    await b.start()
    boss = b
    working = runWorkers
    for (const d of definitions.values()) {
      // One job whose queue cannot be made must not keep the others from running.
      await ensureQueue(b, d)
        .then(() => (runWorkers ? work(b, d) : undefined))
        .catch((error: unknown) =>
          logProblem(new Error(`job "${d.name}": ${error instanceof Error ? error.message : String(error)}`)),
        )
    }
    return b
  })()
  starting.catch(() => {
    starting = null
  })
  return starting
}

export async function stopJobs(): Promise<void> {
  const b = boss
  boss = null
  starting = null
  working = false
  queuesReady.clear()
  workerIds.clear()
  // Graceful: a running job may finish (up to 10 s); what is left is picked up by another instance.
  await b?.stop({ graceful: true, wait: true, timeout: 10_000 })
}

/** Wakes this instance's workers for `name` now instead of at their next poll. */
function nudge(name: string) {
  const b = boss
  const ids = workerIds.get(name)
  if (!b || !ids) return
  // The job may still be inside its caller's transaction: look a moment later, the poll catches the rest.
  setTimeout(() => {
    for (const id of ids) b.notifyWorker(id)
  }, 25).unref?.()
}

/** pg-boss's SQL (`$1`… placeholders) as a Drizzle query, so it runs on the transaction's own connection. */
function asDrizzleSql(text: string, values: unknown[]): SQL {
  const parts = text.split(/\$(\d+)/)
  return sql.join(parts.map((part, i) => (i % 2 ? sql.param(values[Number(part) - 1]) : sql.raw(part))))
}

function adapter(tx: JobTransaction): PgBoss.Db {
  if ('query' in tx && typeof tx.query === 'function' && !('select' in tx)) {
    const client = tx as pg.PoolClient
    return { executeSql: (text, values) => client.query(text, values) }
  }
  const d = tx as Tx | Db
  return { executeSql: async (text, values) => ({ rows: (await d.execute(asDrizzleSql(text, values))).rows }) }
}

/**
 * Queues `name` with `data`; returns the job id (null when `singletonKey` matched a queued job). The job must be
 * defined in this process (defineJob), so its retries, back-off and dead-letter queue are known.
 */
export async function enqueueJob<T extends object>(
  name: string,
  data: T,
  options: EnqueueOptions = {},
): Promise<string | null> {
  const d = definitions.get(name)
  if (!boss && starting) await starting.catch(() => undefined) // this instance's start makes the queues
  const b = boss ?? sender()
  if (boss && d) await ensureQueue(boss, d)
  const id = await b.send(name, data, {
    ...(options.tx ? { db: adapter(options.tx) } : {}),
    ...(options.singletonKey ? { singletonKey: options.singletonKey } : {}),
    ...(options.singletonSeconds ? { singletonSeconds: options.singletonSeconds } : {}),
    ...(options.retryLimit !== undefined ? { retryLimit: options.retryLimit } : {}),
    ...(options.startAfter ? { startAfter: options.startAfter } : {}),
  })
  if (id === null && !options.singletonKey) {
    throw new Error(
      `Job queue "${name}" does not exist: define the job with defineJob("${name}", …) in a server plugin and start a server once`,
    )
  }
  nudge(name)
  return id
}

let senderBoss: PgBoss | null = null
/**
 * Enqueueing needs no started pg-boss (no pool of its own, no maintenance timers): a process that only queues
 * work (a script, a test, a server before its jobs plugin finished starting) writes through the app's pool.
 */
function sender(): PgBoss {
  senderBoss ??= new PgBoss({
    db: { executeSql: (text, values) => usePool().query(text, values) },
    supervise: false,
    schedule: false,
    migrate: false,
  })
  return senderBoss
}

// pg-boss's own job table, declared here for reading only (drizzle-kit never sees it: it is not in schema.ts).
const pgboss = pgSchema('pgboss')
export const bossJobs = pgboss.table('job', {
  id: uuid('id').notNull(),
  name: text('name').notNull(),
  data: jsonb('data'),
  state: text('state').notNull(),
  retryCount: integer('retry_count').notNull(),
  retryLimit: integer('retry_limit').notNull(),
  createdOn: timestamp('created_on', { withTimezone: true }).notNull(),
  startedOn: timestamp('started_on', { withTimezone: true }),
  completedOn: timestamp('completed_on', { withTimezone: true }),
  output: jsonb('output'),
})

/** The error a failed run left (pg-boss keeps the thrown error, serialised, as the job's output). */
export function errorOf(output: unknown): string {
  if (output && typeof output === 'object') {
    const o = output as { message?: unknown; value?: unknown }
    if (typeof o.message === 'string') return o.message.split('\n')[0]!.slice(0, 500)
    if (typeof o.value === 'string') return o.value.slice(0, 500)
    if (o.value && typeof o.value === 'object') return errorOf(o.value) // a time-out: { value: { message } }
  }
  return 'no error recorded'
}

/** The lab's jobs that failed for good, or failed and wait for a retry, newest first (dead-letter copies left out). */
export async function failedJobs(labId: string, limit = 100): Promise<FailedJob[]> {
  const rows = await useDb()
    .select()
    .from(bossJobs)
    .where(and(inArray(bossJobs.state, ['failed', 'retry']), eq(sql`${bossJobs.data}->>'labId'`, labId)))
    .orderBy(desc(bossJobs.createdOn))
    .limit(limit)
  return rows.map(r => ({
    id: r.id,
    name: r.name,
    state: r.state as FailedJob['state'],
    attempts: r.retryCount + 1, // pg-boss counts a retry when it starts it
    retryLimit: r.retryLimit,
    error: errorOf(r.output),
    createdAt: r.createdOn.toISOString(),
    failedAt: r.completedOn?.toISOString() ?? null,
  }))
}
