// Starts one built server (.output, from `nuxt build`) on a free port: the test server of each project, and the
// extra instances the concurrency and fault tests start beside it (several instances sharing one database).
import { spawn, type ChildProcess } from 'node:child_process'
import { createWriteStream, existsSync, mkdirSync, readFileSync } from 'node:fs'
import { createServer } from 'node:net'

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer()
      .listen(0, '127.0.0.1', () => {
        const port = (srv.address() as { port: number }).port
        srv.close(() => resolve(port))
      })
      .on('error', reject)
  })
}

/** SMTP_URL and friends from .data/smtp.env (written by scripts/smtp.sh), unless the environment has them. */
export function mailEnv(): Record<string, string> {
  const local: Record<string, string> = {}
  if (existsSync('.data/smtp.env')) {
    for (const line of readFileSync('.data/smtp.env', 'utf8').split('\n')) {
      const m = /^([A-Z_]+)=(.*)$/.exec(line.trim())
      if (m) local[m[1]!] = m[2]!
    }
  }
  const env: Record<string, string> = {
    SMTP_URL: process.env.SMTP_URL || local.SMTP_URL || '',
    DW_DEV_OUTBOX: process.env.DW_DEV_OUTBOX || local.DW_DEV_OUTBOX || '',
    DW_MAIL_DIR: process.env.DW_MAIL_DIR || local.DW_MAIL_DIR || '',
    // Quick rounds and retries, so the tests see a retried message arrive in about a second.
    DW_JOBS_POLL_SECONDS: process.env.DW_JOBS_POLL_SECONDS || '0.5',
    DW_MAIL_RETRY_SECONDS: process.env.DW_MAIL_RETRY_SECONDS || '1',
    // The diagnostic jobs tests/api/jobs.test.ts watches the queue with (server/services/diagnosticJobs.ts).
    DW_DIAGNOSTIC_JOBS: '1',
  }
  if (!env.SMTP_URL)
    throw new Error('SMTP_URL is not set: run the tests with `npm test` (it starts the local fake SMTP)')
  return env
}

export interface ServerInstance {
  baseURL: string
  child: ChildProcess
  log: () => string
  stop: () => Promise<void>
}

/** Spawns `.output/server/index.mjs` against `databaseUrl` and waits until /api/health answers (any status). */
export async function startServer(opts: {
  databaseUrl: string
  name: string
  env?: Record<string, string>
}): Promise<ServerInstance> {
  const port = await freePort()
  let output = ''
  const child = spawn(process.execPath, ['.output/server/index.mjs'], {
    env: {
      ...process.env,
      ...mailEnv(),
      HOST: '127.0.0.1',
      PORT: String(port),
      DATABASE_URL: opts.databaseUrl,
      ...opts.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  // Also kept in .data/test-server-<name>.log, for a server that dies in the middle of a run.
  mkdirSync('.data', { recursive: true })
  const logFile = createWriteStream(`.data/test-server-${opts.name}.log`)
  child.stdout!.on('data', d => {
    output += d
    logFile.write(d)
  })
  child.stderr!.on('data', d => {
    output += d
    logFile.write(d)
  })
  const baseURL = `http://127.0.0.1:${port}`
  for (let i = 0; ; i++) {
    if (child.exitCode !== null) throw new Error(`server exited early:\n${output}`)
    try {
      await fetch(`${baseURL}/api/health`)
      break
    } catch {
      /* not up yet */
    }
    if (i > 200) throw new Error(`server did not answer ${baseURL}/api/health in 20 s:\n${output}`)
    await new Promise(r => setTimeout(r, 100))
  }
  const stop = async () => {
    if (child.exitCode !== null) return
    child.kill('SIGTERM')
    await new Promise(r => child.once('exit', r))
  }
  return { baseURL, child, log: () => output, stop }
}
