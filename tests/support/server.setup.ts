// Starts the built server (.output, from `nuxt build`) on a free port against the test database, once per
// test project, and hands its address to the tests as `inject('baseURL')`.
import { spawn, type ChildProcess } from 'node:child_process'
import { createWriteStream, existsSync, mkdirSync, readFileSync } from 'node:fs'
import { createServer } from 'node:net'
import type { TestProject } from 'vitest/node'
import pg from 'pg'

declare module 'vitest' {
  export interface ProvidedContext { baseURL: string, databaseUrl: string }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer().listen(0, '127.0.0.1', () => {
      const port = (srv.address() as { port: number }).port
      srv.close(() => resolve(port))
    }).on('error', reject)
  })
}

async function waitFor(url: string, child: ChildProcess, log: () => string) {
  for (let i = 0; i < 200; i++) {
    if (child.exitCode !== null) throw new Error(`server exited early:\n${log()}`)
    try {
      if ((await fetch(url)).ok) return
    } catch { /* not up yet */ }
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error(`server did not answer ${url} in 20 s:\n${log()}`)
}

/** SMTP_URL and friends from .data/smtp.env (written by scripts/smtp.sh), unless the environment has them. */
function mailEnv(): Record<string, string> {
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
    DW_MAIL_POLL_MS: process.env.DW_MAIL_POLL_MS || '200',
    DW_MAIL_RETRY_BASE_MS: process.env.DW_MAIL_RETRY_BASE_MS || '500',
  }
  if (!env.SMTP_URL) throw new Error('SMTP_URL is not set: run the tests with `npm test` (it starts the local fake SMTP)')
  return env
}

export default async function setup(project: TestProject) {
  const databaseUrl = process.env.DATABASE_URL
  if (!databaseUrl) throw new Error('DATABASE_URL is not set: run the tests with `npm test`')
  // Throttling counts failures in the database: start each run from a clean slate.
  const client = new pg.Client({ connectionString: databaseUrl })
  await client.connect()
  await client.query('delete from sign_in_failures')
  await client.end()

  const port = await freePort()
  let output = ''
  const child = spawn(process.execPath, ['.output/server/index.mjs'], {
    env: { ...process.env, ...mailEnv(), HOST: '127.0.0.1', PORT: String(port), DATABASE_URL: databaseUrl },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  // Also kept in .data/test-server-<project>.log, for a server that dies in the middle of a run.
  mkdirSync('.data', { recursive: true })
  const logFile = createWriteStream(`.data/test-server-${project.name}.log`)
  child.stdout!.on('data', (d) => { output += d; logFile.write(d) })
  child.stderr!.on('data', (d) => { output += d; logFile.write(d) })
  const baseURL = `http://127.0.0.1:${port}`
  await waitFor(`${baseURL}/api/health`, child, () => output)
  project.provide('baseURL', baseURL)
  project.provide('databaseUrl', databaseUrl)
  return async () => {
    child.kill('SIGTERM')
    await new Promise(r => child.once('exit', r))
  }
}
