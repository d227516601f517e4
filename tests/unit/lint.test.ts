// The lint gate's layer rules (eslint.config.mjs): the pure core (shared/physics, geometry, shared/editor,
// shared/schemas) may not import Vue, Nitro, Drizzle, node:*, Konva or ECharts — in any form, through any alias —
// and every message says why. Replaces the old regex check, which missed side-effect imports, import() and aliases.
import { ESLint } from 'eslint'
import { describe, expect, it } from 'vitest'

const eslint = new ESLint({ cwd: new URL('../..', import.meta.url).pathname })
const lint = async (code: string, filePath: string) => (await eslint.lintText(code, { filePath }))[0]!.messages

describe('lint: the pure core stays pure', { timeout: 60_000 }, () => {
  const forbidden: Array<[string, RegExp]> = [
    [`import 'vue'`, /independent of Vue/], // a side-effect import
    [`import { ref } from 'vue'`, /independent of Vue/],
    [`import { defineStore } from 'pinia'`, /independent of Vue and Pinia/],
    [`import { createError } from 'h3'`, /independent of Nuxt\/Nitro/],
    [`import { useRuntimeConfig } from '#imports'`, /independent of Nuxt\/Nitro/],
    [`import { sql } from 'drizzle-orm'`, /must not touch the database/],
    [`import { useDb } from '~~/server/utils/db'`, /must not touch the database or the server/],
    [`import { useDb } from '../../server/utils/db'`, /must not touch the database or the server/],
    [`import { readFileSync } from 'node:fs'`, /no Node built-ins/],
    [`import { join } from 'path'`, /no Node built-ins/],
    [`import Konva from 'konva'`, /draws nothing/],
    [`import * as echarts from 'echarts/core'`, /draws nothing/],
    [`import { useSessionStore } from '~/stores/session'`, /reach up into the UI/],
    [`export const load = () => import('./other')`, /No dynamic import\(\)/],
  ]
  for (const dir of ['shared/physics', 'geometry', 'shared/editor', 'shared/schemas']) {
    it(`refuses each forbidden import in ${dir}, saying why`, async () => {
      for (const [code, why] of forbidden) {
        const messages = await lint(`${code}\n`, `${dir}/example.ts`)
        expect(messages.map(m => m.message).join(' | '), code).toMatch(why)
        expect(
          messages.every(m => m.severity === 2),
          code,
        ).toBe(true)
      }
    })
  }

  it('allows the same imports outside the core, and the core its own imports', async () => {
    expect(
      await lint(
        `import { ref } from 'vue'\nimport Konva from 'konva'\nexport const a = [ref, Konva]\n`,
        'components/viewer/example.ts',
      ),
    ).toEqual([])
    expect(
      await lint(
        `import { z } from 'zod'\nimport { add } from '~~/geometry/vec'\nexport const a = [z, add]\n`,
        'shared/physics/example.ts',
      ),
    ).toEqual([])
  })

  it('reports ordinary lint errors too (the gate fails on them)', async () => {
    const messages = await lint(`export function f() {\n  debugger\n  return 1\n}\n`, 'server/utils/example.ts')
    expect(messages).toContainEqual(expect.objectContaining({ ruleId: 'no-debugger', severity: 2 }))
  })
})
