// Starts the built server (.output, from `nuxt build`) on a free port against the test database, once per
// test project, and hands its address to the tests as `inject('baseURL')`.
import type { TestProject } from 'vitest/node'
import pg from 'pg'
import { startServer } from './instance'

declare module 'vitest' {
  export interface ProvidedContext {
    baseURL: string
    databaseUrl: string
  }
}

export default async function setup(project: TestProject) {
  const databaseUrl = process.env.DATABASE_URL
  if (!databaseUrl) throw new Error('DATABASE_URL is not set: run the tests with `npm test`')
  // Throttling counts failures in the database: start each run from a clean slate.
  const client = new pg.Client({ connectionString: databaseUrl })
  await client.connect()
  await client.query('delete from sign_in_failures')
  await client.end()

  const server = await startServer({ databaseUrl, name: project.name })
  const health = await fetch(`${server.baseURL}/api/health`)
  if (!health.ok) throw new Error(`the test server is not healthy (${health.status}):\n${server.log()}`)
  project.provide('baseURL', server.baseURL)
  project.provide('databaseUrl', databaseUrl)
  return server.stop
}
