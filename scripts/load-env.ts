// Reads .data/postgres.env (written by scripts/db.sh) unless DATABASE_URL is already set.
import { existsSync, readFileSync } from 'node:fs'

export function loadDbEnv(target: 'app' | 'test' = 'app'): string {
  const file = new URL('../.data/postgres.env', import.meta.url)
  const local: Record<string, string> = {}
  if (existsSync(file)) {
    for (const line of readFileSync(file, 'utf8').split('\n')) {
      const m = /^([A-Z_]+)=(.*)$/.exec(line.trim())
      if (m) local[m[1]!] = m[2]!
    }
  }
  const url =
    target === 'test'
      ? process.env.TEST_DATABASE_URL || local.TEST_DATABASE_URL || process.env.DATABASE_URL
      : process.env.DATABASE_URL || local.DATABASE_URL
  if (!url) throw new Error('No database: run `npm run db:start` or set DATABASE_URL')
  process.env.DATABASE_URL = url
  return url
}
