import { readFileSync, existsSync } from 'node:fs'
import { describe, expect, it } from 'vitest'

// Nuxt registers every file under components/ as a component unless told otherwise; the helpers beside the
// components (components/*/lib/*.ts) are plain modules and must not appear as phantom components.
describe('component registry', () => {
  const declarations = '.nuxt/components.d.ts'

  it('registers only .vue files as components', () => {
    expect(existsSync(declarations), 'run `nuxt prepare` (npm install does) to generate the registry').toBe(true)
    const names = [...readFileSync(declarations, 'utf8').matchAll(/export const (\w+)/g)].map(m => m[1]!)
    expect(names.length).toBeGreaterThan(20)
    expect(names.filter(name => /Lib[A-Z]/.test(name))).toEqual([])
  })
})
