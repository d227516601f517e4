// Text hygiene: every string field of every payload schema refuses NUL and lone surrogates, naming the field.
import { describe, expect, it } from 'vitest'
import type { z } from 'zod'
import { signInBody } from '#shared/schemas/auth'
import { parseChipDocument } from '#shared/schemas/chip'
import {
  designCreate,
  designListQuery,
  designUpdate,
  duplicateBody,
  dxfQuery,
  revisionCreate,
} from '#shared/schemas/designs'
import { junctionRequest, networkRequest, documentRequest } from '#shared/schemas/forecast'
import { invitationAccept, invitationCreate, invitationTokenParams, newAccount } from '#shared/schemas/invitations'
import { commentCreate, threadCreate, verdictBody } from '#shared/schemas/review'
import { orderMessage, orderMove, releaseBody } from '#shared/schemas/orders'
import { safeText, textProblem } from '#shared/schemas/text'
import { loadDocumentFixture } from './load-fixture'

const uuid = '0b7f8f52-5d0e-4b8e-9d43-6f1f6a4d2c11'
/** A valid sample of each payload; every string in it is replaced in turn. */
const SAMPLES: Array<[string, z.ZodType, unknown]> = [
  ['signInBody', signInBody, { email: 'a@b.example', password: 'secret' }],
  ['designCreate', designCreate, { name: 'Chip', description: 'd', processId: 'film-mask-soft-litho', message: 'm' }],
  ['designUpdate', designUpdate, { name: 'Chip', description: 'd' }],
  ['designListQuery', designListQuery, { q: 'chip' }],
  ['revisionCreate', revisionCreate, { parentId: uuid, message: 'm', document: {} }],
  ['duplicateBody', duplicateBody, { targetLabId: uuid, name: 'Copy' }],
  ['dxfQuery', dxfQuery, { layers: 'CH-50um' }],
  ['invitationCreate', invitationCreate, { email: 'a@b.example', role: 'designer' }],
  ['invitationTokenParams', invitationTokenParams, { token: 'a'.repeat(43) }],
  ['newAccount', newAccount, { name: 'Ada', password: 'long enough password' }],
  ['invitationAccept', invitationAccept, { name: 'Ada', password: 'long enough password' }],
  ['threadCreate', threadCreate, { anchor: { x: 0, y: 0, elementId: 'tj-1' }, body: 'look here' }],
  ['commentCreate', commentCreate, { body: 'ok' }],
  ['verdictBody', verdictBody, { verdict: 'approve', note: 'fine' }],
  ['releaseBody', releaseBody, { note: 'go', order: { poNumber: 'PO-7', notes: 'two wafers', dueDate: '2027-01-31' } }],
  ['orderMove', orderMove, { status: 'shipped', note: 'sent', trackingNumber: 'TRK-1' }],
  ['orderMessage', orderMessage, { body: 'When will it ship?' }],
  [
    'junctionRequest',
    junctionRequest,
    {
      junction: { kind: 't-junction', mainWidth: '100 um', depth: '50 um' },
      continuous: { name: 'oil', viscosity: '3 mPa*s', density: '800 kg/m^3' },
      dispersed: { liquid: 'water' },
      interfacialTension: '5 mN/m',
      flow: { continuous: '10 uL/min', dispersed: '5 uL/min' },
    },
  ],
  [
    'networkRequest',
    networkRequest,
    {
      network: {
        channels: [{ id: 'a', from: 'in', to: 'out', width: '100 um', depth: '50 um', length: '1 cm' }],
        sources: [
          { node: 'in', pressure: '100 mbar' },
          { node: 'out', pressure: 0 },
        ],
        liquid: { liquid: 'water' },
        parallelSets: [['a', 'a']],
      },
    },
  ],
  ['documentRequest', documentRequest, { document: {}, operatingPoint: 'op-1' }],
]
/** Fixed choices and formats (enums, literals, UUIDs): refused too, by their own message. */
const CHOICES = new Set([
  'parentId',
  'targetLabId',
  'role',
  'verdict',
  'status',
  'kind',
  'units',
  'mode',
  'unit',
  'phase',
  'resistanceMethod',
  'surfactant',
])

function stringLeaves(v: unknown, path: (string | number)[] = []): (string | number)[][] {
  if (typeof v === 'string') return [path]
  if (Array.isArray(v)) return v.flatMap((x, i) => stringLeaves(x, [...path, i]))
  if (v && typeof v === 'object') return Object.entries(v).flatMap(([k, x]) => stringLeaves(x, [...path, k]))
  return []
}
function withLeaf(v: unknown, path: (string | number)[], f: (s: string) => string): unknown {
  if (path.length === 0) return f(v as string)
  const copy = (Array.isArray(v) ? [...v] : { ...(v as object) }) as Record<string | number, unknown>
  copy[path[0]!] = withLeaf(copy[path[0]!], path.slice(1), f)
  return copy
}
const BROKEN = {
  NUL: (s: string) => `${s.slice(0, 1)}\u0000${s.slice(1)}`,
  'lone surrogate': (s: string) => `${s}\ud800`,
}

describe('textProblem and safeText', () => {
  it('names NUL and lone surrogates with their position; keeps real astral characters and plain text', () => {
    expect(textProblem('ab\u0000c')).toMatch(/NUL character \(U\+0000, at character 3\)/)
    expect(textProblem('x\ud800')).toMatch(/lone UTF-16 surrogate U\+D800 at character 2/)
    expect(textProblem('\udc00x')).toMatch(/U\+DC00 at character 1/)
    expect(textProblem('drops 💧 µm ±')).toBeNull()
    expect(textProblem('')).toBeNull()
  })
  it("stops at the first problem: the field's own checks add nothing", () => {
    const r = safeText(undefined, 'Name').min(1).max(3).regex(/^a+$/).safeParse('\u0000bbbbbb')
    expect(r.success).toBe(false)
    expect(r.error!.issues.map(i => i.message)).toEqual([
      'Name must not contain a NUL character (U+0000, at character 1): remove it',
    ])
  })
})

describe('every string field of every payload refuses NUL and lone surrogates, naming the field', () => {
  for (const [name, schema, sample] of SAMPLES) {
    it(name, () => {
      expect(schema.safeParse(sample).success, `${name} sample is valid`).toBe(true)
      const leaves = stringLeaves(sample)
      expect(leaves.length).toBeGreaterThan(0)
      for (const path of leaves) {
        for (const [problem, breakIt] of Object.entries(BROKEN)) {
          const r = schema.safeParse(withLeaf(sample, path, breakIt))
          const where = `${name}.${path.join('.')} with a ${problem}`
          expect(r.success, where).toBe(false)
          const issue = r.error!.issues.find(i => i.path.join('.') === path.join('.'))
          expect(issue, `${where}: ${JSON.stringify(r.error!.issues)}`).toBeDefined()
          if (!CHOICES.has(String(path[path.length - 1])))
            expect(issue!.message, where).toMatch(problem === 'NUL' ? /NUL character/ : /lone UTF-16 surrogate/)
        }
      }
    })
  }
  it('the chip document: names, ids, terminals, text marks, liquids (through parseChipDocument)', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    const leaves = stringLeaves(doc).filter(p => p[0] !== 'version')
    expect(leaves.length).toBeGreaterThan(20)
    for (const path of leaves) {
      const r = parseChipDocument(withLeaf(doc, path, BROKEN.NUL))
      expect(r.ok, path.join('.')).toBe(false)
      if (r.ok) continue
      // A liquid is one of two shapes: the refusal sits on the liquid and names the broken text.
      const hit = r.errors.find(
        e =>
          e.path === path.join('.') ||
          (path.some(k => k === 'continuousLiquid' || k === 'dispersedLiquid') &&
            e.path === path.slice(0, -1).join('.') &&
            /NUL character/.test(e.message)),
      )
      expect(hit, `${path.join('.')}: ${JSON.stringify(r.errors)}`).toBeDefined()
    }
    const named = parseChipDocument({ ...doc, name: 'chip\ud83d' })
    expect(named.ok).toBe(false)
    if (!named.ok)
      expect(named.errors[0]!.message).toMatch(
        /^Design name contains a broken character \(a lone UTF-16 surrogate U\+D83D/,
      )
  })
})
