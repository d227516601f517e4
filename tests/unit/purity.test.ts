import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'

// shared/physics and geometry run in the browser and on the server alike: they must import nothing from
// Vue, Pinia, Nuxt/Nitro/h3, Drizzle, pg or node:* (the house rule a lint override would state).
const FORBIDDEN = /from\s+['"](vue|pinia|@pinia\/|nuxt|#app|#imports|h3|nitropack|drizzle-orm|pg|node:|fs|path|os|child_process)/

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name)
    return statSync(path).isDirectory() ? files(path) : path.endsWith('.ts') ? [path] : []
  })
}

describe('the pure core stays pure', () => {
  for (const dir of ['shared/physics', 'geometry', 'shared/schemas', 'shared/editor', 'shared/imaging']) {
    it(`${dir} imports no framework, database or Node module`, () => {
      const offenders = files(dir).filter(f => readFileSync(f, 'utf8').split('\n').some(line => FORBIDDEN.test(line)))
      expect(offenders).toEqual([])
      expect(files(dir).length).toBeGreaterThan(0)
    })
  }
})
