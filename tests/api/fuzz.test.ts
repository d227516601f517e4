// Property-based fuzzing of every write route (POST/PATCH/DELETE under server/api/**, read from the file tree):
// schema-shaped bodies with wrong values — huge, negative, NaN-like, NUL, lone surrogates, long, deeply nested,
// wrong types, extra keys, arrays for objects — plus random JSON and malformed text. No answer may be ≥ 500.
// Routes run eight at a time on a server instance of their own (so a crash cannot take the shared test server
// down); each route's property runs in order, so fast-check shrinks a failing body to a small one.
import { randomBytes, randomUUID } from 'node:crypto'
import fc from 'fast-check'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { ApiClient } from '../support/api'
import { fixtureDocument, makeLab, TEST_PASSWORD } from '../support/factory'
import { startServer, type ServerInstance } from '../support/instance'
import { apiRoutes, fill, isWrite, type ApiRoute } from '../support/routes'
import forecastExample from '../fixtures/forecast/t-junction-request.json'

import type { Role } from '../../shared/utils/roles'

/** A lab liquid with a two-row temperature table (invented values). */
const LAB_LIQUID = {
  kind: 'liquid',
  key: 'fuzz-base-oil',
  name: 'Fuzz base oil',
  source: 'measured in our lab',
  table: [
    { temperatureC: 20, viscosityMPaS: 4.8, densityKgPerM3: 905, surfaceTensionMNPerM: 21 },
    { temperatureC: 40, viscosityMPaS: 3.2, densityKgPerM3: 890, surfaceTensionMNPerM: 19.5 },
  ],
}

/** The forecast example without its flows: a plan request's junction part. */
const { flow: _flow, ...planJunction } = forecastExample as Record<string, unknown>

const RUNS_PER_ROUTE = Number(process.env.DW_FUZZ_RUNS ?? 110) // × 19 routes ≥ 2,000 bodies
const CONCURRENCY = 8
const SEED = Number(process.env.DW_FUZZ_SEED ?? 20_260_510)
const REQUEST_MS = 15_000

// ---------------------------------------------------------------------------------------------------------------
// Bodies

type Body = { json: unknown; changed?: string } | { raw: string }

const nastyNumber = fc.constantFrom(
  1e308,
  -1e308,
  1e29,
  -1e29,
  1e11,
  2 ** 53 + 2,
  -(2 ** 63),
  -1,
  -1e-9,
  0,
  -0,
  5e-324,
  0.1 + 0.2,
  1e6,
  100_000,
)
const nastyText = fc.constantFrom(
  'NaN',
  'Infinity',
  '-Infinity',
  '1e999',
  '-1e999',
  '-0',
  '0x1F',
  '',
  ' ',
  '\u0000',
  'a\u0000b',
  '\ud800',
  'x\udfffy',
  '\udc00\ud800',
  '\u202eevil',
  '\ufeff',
  '💧'.repeat(300),
  '<img src=x onerror=alert(1)>',
  "'; drop table revisions; --",
  '../../../etc/passwd',
  '%00',
  '${7*7}',
  '__proto__',
  'constructor',
  'e'.repeat(70),
  'x'.repeat(100_000),
  'é'.repeat(30_000),
  '12 kg',
  '-5 um',
  '1e308 um',
  'NaN um',
)
const wrongType = fc.constantFrom<unknown>(
  null,
  true,
  false,
  [],
  {},
  [[]],
  [{}],
  [null],
  { '': null },
  { __proto__: null },
  [1, 'a', null],
)
// Nested values deep enough to hurt a recursive walker; the deepest go as text (below), built without recursion.
const deep = fc.constantFrom(64, 200).map(depth => {
  let v: unknown = 1
  for (let i = 0; i < depth; i++) v = i % 2 ? { a: v } : [v]
  return v
})
const deepText = fc
  .constantFrom(1_000, 10_000, 200_000)
  .chain(depth =>
    fc.constantFrom(
      `${'['.repeat(depth)}1${']'.repeat(depth)}`,
      `${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`,
      `{"name":${'['.repeat(depth)}${']'.repeat(depth)}}`,
    ),
  )
const nastyValue: fc.Arbitrary<unknown> = fc.oneof(
  nastyNumber,
  nastyText,
  wrongType,
  deep,
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.double(),
  fc.integer(),
  fc.bigInt().map(String),
  fc.jsonValue({ maxDepth: 3 }),
)

/** Every path into a value (the root included), for the mutations below. */
function paths(value: unknown, prefix: (string | number)[] = [], out: (string | number)[][] = []) {
  out.push(prefix)
  if (Array.isArray(value)) value.forEach((v, i) => paths(v, [...prefix, i], out))
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) paths(v, [...prefix, k], out)
  return out
}

type Mutation = {
  at: number
  kind: 'tweak' | 'replace' | 'extra-key' | 'as-array' | 'delete'
  value: unknown
  key: string
  op: number
}
const mutation: fc.Arbitrary<Mutation> = fc.record({
  at: fc.nat(),
  kind: fc.constantFrom('tweak', 'tweak', 'tweak', 'tweak', 'replace', 'replace', 'extra-key', 'as-array', 'delete'),
  value: nastyValue,
  key: fc.constantFrom('extra', '__proto__', 'constructor', 'isAdmin', 'labId', ''),
  op: fc.nat(),
})

// Type-preserving changes of one leaf: the body keeps its shape and only the value is wrong.
const TEXT_TWEAKS: Array<(s: string) => string> = [
  s => `${s}\u0000`,
  s => `\u0000${s}`,
  s => `${s.slice(0, 1)}\u0000${s.slice(1)}`,
  s => `${s}\ud800`,
  s => `\udfff${s}`,
  s => `${s}\ud83d`,
  s => `${s}${'x'.repeat(100_000)}`,
  s => s.repeat(500),
  () => '',
  () => ' ',
  () => 'NaN',
  () => '1e999',
  s => `${s}\u202e`,
  s => `${s} '; drop table revisions; --`,
]
const NUMBER_TWEAKS: Array<(n: number) => unknown> = [
  () => 1e308,
  () => -1e308,
  () => 1e29,
  n => n * 1e9,
  n => -n,
  () => -1,
  () => 0,
  () => 5e-324,
  n => n + 0.5,
  () => 2 ** 53 + 2,
  n => String(n),
  () => 'NaN',
  () => '1e999',
  () => null,
]
const OTHER_TWEAKS: Array<(v: unknown) => unknown> = [
  v => String(v),
  () => 1,
  () => 0,
  () => null,
  () => 'true',
  v => [v],
]

function tweak(value: unknown, op: number): unknown {
  if (typeof value === 'string') return TEXT_TWEAKS[op % TEXT_TWEAKS.length]!(value)
  if (typeof value === 'number') return NUMBER_TWEAKS[op % NUMBER_TWEAKS.length]!(value)
  return OTHER_TWEAKS[op % OTHER_TWEAKS.length]!(value)
}

/** The template with the mutations applied, and a note of what changed where (for the report). */
function mutate(template: unknown, mutations: Mutation[]): { json: unknown; changed: string } {
  let root = structuredClone(template)
  const notes: string[] = []
  for (const m of mutations) {
    const all = paths(root)
    const get = (p: (string | number)[]) => p.reduce<any>((v, k) => v?.[k], root)
    const leaves = all.filter(p => {
      const v = get(p)
      return v === null || typeof v !== 'object'
    })
    const pool = m.kind === 'tweak' && leaves.length ? leaves : all
    const path = pool[m.at % pool.length]!
    const set = (v: unknown) => {
      if (path.length === 0) {
        root = v
        return
      }
      const parent = get(path.slice(0, -1))
      if (parent && typeof parent === 'object') parent[path.at(-1)!] = v
    }
    const here = get(path)
    const brief = (v: unknown) => {
      const t = JSON.stringify(v) ?? String(v)
      return t.length > 80 ? `${t.slice(0, 80)}… (${t.length} characters)` : t
    }
    notes.push(
      `${path.join('.') || '(root)'} ${m.kind}${m.kind === 'replace' || m.kind === 'extra-key' ? ` ${m.kind === 'extra-key' ? `${JSON.stringify(m.key)}: ` : ''}${brief(m.value)}` : m.kind === 'tweak' ? ` → ${brief(tweak(here, m.op))}` : ''}`,
    )
    if (m.kind === 'tweak') set(tweak(here, m.op))
    else if (m.kind === 'replace') set(m.value)
    else if (m.kind === 'as-array') set([here])
    else if (m.kind === 'delete' && path.length) {
      const parent = get(path.slice(0, -1))
      if (Array.isArray(parent)) parent.splice(path.at(-1) as number, 1)
      else if (parent && typeof parent === 'object') delete parent[path.at(-1)!]
    } else if (m.kind === 'extra-key' && here && typeof here === 'object' && !Array.isArray(here)) {
      Object.defineProperty(here, m.key, { value: m.value, enumerable: true, configurable: true, writable: true })
    }
  }
  return { json: root, changed: notes.join('; ') }
}

function bodies(templates: unknown[]): fc.Arbitrary<Body> {
  const shaped = fc
    .tuple(fc.constantFrom(...templates), fc.array(mutation, { minLength: 1, maxLength: 2 }))
    .map(([t, ms]) => mutate(t, ms))
  return fc.oneof(
    { weight: 6, arbitrary: shaped },
    { weight: 2, arbitrary: fc.jsonValue().map(json => ({ json })) },
    { weight: 1, arbitrary: nastyValue.map(json => ({ json })) },
    {
      weight: 1,
      arbitrary: fc
        .oneof(
          fc.string(),
          deepText,
          fc.constantFrom('{', '{"a":', '[1,', 'nul', '"\\ud800"', '{"a":1}{"b":2}', '\u0000', '1e999'),
        )
        .map(raw => ({ raw })),
    },
  )
}

const show = (b: Body) => {
  if ('raw' in b)
    return `raw ${JSON.stringify(b.raw.slice(0, 300))}${b.raw.length > 300 ? `… (${b.raw.length} characters)` : ''}`
  const text = JSON.stringify(b.json) ?? String(b.json)
  const cut = text.length > 300 ? `${text.slice(0, 300)}… (${text.length} characters)` : text
  return 'changed' in b && b.changed ? `[${b.changed}] ${cut}` : cut
}

// ---------------------------------------------------------------------------------------------------------------
// The lab the bodies are sent into

let server: ServerInstance
let started: Date
type Setup = Awaited<ReturnType<typeof setUp>>
let setup: Setup

async function setUp(baseURL: string) {
  const roles: Role[] = ['admin', 'designer', 'reviewer', 'fabricator', 'experimenter', 'experimenter', 'designer']
  const { lab, people } = await makeLab(roles)
  const as = async (i: number) => new ApiClient(baseURL).signIn(people[i]!.email, TEST_PASSWORD)
  const [admin, designer, reviewer, fabricator, leaver] = [
    await as(0),
    await as(1),
    await as(2),
    await as(3),
    await as(6),
  ]
  const ok = async <T>(p: Promise<{ status: number; json: any }>, what: string): Promise<T> => {
    const r = await p
    if (r.status >= 300) throw new Error(`${what}: ${r.status} ${JSON.stringify(r.json)}`)
    return r.json as T
  }
  const doc = fixtureDocument()
  const labPath = `/api/labs/${lab.id}`
  const main = await ok<{ designId: string; revisionId: string }>(
    designer.post(`${labPath}/designs`, { name: 'Fuzz target', document: doc }),
    'create',
  )
  const renamed = await ok<{ designId: string }>(
    designer.post(`${labPath}/designs`, { name: 'Fuzz rename target', document: doc }),
    'create',
  )
  const toRelease = await ok<{ designId: string; revisionId: string }>(
    designer.post(`${labPath}/designs`, { name: 'Fuzz release target', document: doc }),
    'create',
  )
  const released = await ok<{ designId: string; revisionId: string }>(
    designer.post(`${labPath}/designs`, { name: 'Fuzz released', document: doc }),
    'create',
  )
  for (const r of [main.revisionId, toRelease.revisionId, released.revisionId]) {
    await ok(
      designer.post(`${labPath}/revisions/${r}/review-requests`, { reviewerIds: [people[2]!.id] }),
      'review request',
    )
  }
  for (const r of [toRelease.revisionId, released.revisionId])
    await ok(reviewer.post(`${labPath}/revisions/${r}/verdicts`, { verdict: 'approve' }), 'approve')
  const order = await ok<{ orderId: string }>(
    admin.post(`${labPath}/revisions/${released.revisionId}/release`, {}),
    'release',
  )
  const thread = await ok<{ threadId: string }>(
    designer.post(`${labPath}/revisions/${main.revisionId}/threads`, { anchor: { x: 1, y: 1 }, body: 'fuzz' }),
    'thread',
  )
  await ok(
    admin.post(`${labPath}/invitations`, { email: `fuzz-${randomUUID().slice(0, 8)}@test.example`, role: 'designer' }),
    'invite',
  )
  const invitations = await ok<Array<{ id: string }>>(admin.get(`${labPath}/invitations`), 'invitations')
  const run = await ok<{ id: string }>(
    designer.post(`${labPath}/revisions/${main.revisionId}/bench-runs`, { source: 'typed', values: [50, 51, 52] }),
    'bench run',
  )
  const entry = await ok<{ id: string }>(admin.post(`${labPath}/libraries`, LAB_LIQUID), 'library entry')
  return {
    lab,
    people,
    doc,
    main,
    renamed,
    toRelease,
    released,
    threadId: thread.threadId,
    invitationId: invitations[0]!.id,
    runId: run.id,
    orderId: order.orderId,
    entryId: entry.id,
    clients: { admin, designer, fabricator, leaver, anonymous: new ApiClient(baseURL) },
  }
}

/** For each write route: who sends, into which ids, and the valid bodies the mutations start from. */
function plan(route: ApiRoute, s: Setup) {
  const { admin, fabricator, leaver, anonymous } = s.clients
  const params = {
    labId: s.lab.id,
    designId: s.main.designId,
    revisionId: s.main.revisionId,
    threadId: s.threadId,
    invitationId: s.invitationId,
    userId: s.people[5]!.id,
    token: randomBytes(32).toString('base64url'),
    tokenId: randomUUID(),
    runId: s.runId,
    micrographId: randomUUID(),
    orderId: s.orderId,
    asBuiltId: randomUUID(),
    entryId: s.entryId,
  }
  const channel = (id: string, from: string, to: string) => ({
    id,
    from,
    to,
    width: '100 um',
    depth: '50 um',
    length: '10 mm',
  })
  const plans: Record<string, { client: ApiClient; params?: Partial<typeof params>; templates: unknown[] }> = {
    'POST /api/account/tokens': {
      client: admin,
      templates: [
        { name: 'fuzz script', labId: s.lab.id, role: 'reviewer' },
        { name: 'too high?', labId: s.lab.id, role: 'admin' },
      ],
    },
    'DELETE /api/account/tokens/[tokenId]': { client: admin, templates: [{}] },
    'POST /api/auth/login': {
      client: anonymous,
      templates: [{ email: `nobody-${randomUUID().slice(0, 6)}@test.example`, password: 'not-the-password-1' }],
    },
    'POST /api/auth/logout': { client: leaver, templates: [{}] },
    'POST /api/auth/logout-everywhere': { client: leaver, templates: [{}] },
    'POST /api/auth/password': {
      client: leaver,
      templates: [{ currentPassword: 'not-the-password-1', newPassword: 'a fresh passphrase 42' }],
    },
    'POST /api/auth/password-reset': {
      client: anonymous,
      templates: [{ email: `nobody-${randomUUID().slice(0, 6)}@test.example` }],
    },
    'POST /api/auth/password-reset/[token]': { client: anonymous, templates: [{ password: 'a fresh passphrase 42' }] },
    'POST /api/invitations/[token]/accept': {
      client: anonymous,
      templates: [{ name: 'New Person', password: 'long-enough-password' }, {}],
    },
    'POST /api/labs/[labId]/designs': {
      client: admin,
      templates: [
        { name: 'Fuzzed', description: 'fuzz', processId: 'film-mask-soft-litho', document: s.doc, message: 'first' },
        { name: 'Starter' },
      ],
    },
    'PATCH /api/labs/[labId]/designs/[designId]': {
      client: admin,
      params: { designId: s.renamed.designId },
      templates: [{ name: 'Renamed', description: 'd', archived: false }, { archived: true }],
    },
    'POST /api/labs/[labId]/designs/[designId]/revisions': {
      client: admin,
      templates: [{ parentId: s.main.revisionId, message: 'fuzzed save', document: s.doc, branch: true }],
    },
    'POST /api/labs/[labId]/invitations': {
      client: admin,
      templates: [{ email: 'fuzz-invitee@test.example', role: 'designer' }],
    },
    'DELETE /api/labs/[labId]/invitations/[invitationId]': { client: admin, templates: [{}] },
    'DELETE /api/labs/[labId]/members/[userId]': {
      client: admin,
      params: { userId: s.people[4]!.id },
      templates: [{}],
    },
    'PATCH /api/labs/[labId]/members/[userId]': {
      client: admin,
      templates: [{ role: 'experimenter' }, { role: 'reviewer' }],
    },
    'POST /api/labs/[labId]/revisions/[revisionId]/duplicate': {
      client: admin,
      templates: [{ targetLabId: s.lab.id, name: 'Fuzzed copy' }],
    },
    'POST /api/labs/[labId]/orders/[orderId]/status': {
      client: fabricator,
      templates: [
        { status: 'on-hold', note: 'n' },
        { status: 'received' },
        { status: 'in-fabrication', note: 'started' },
        { status: 'shipped', trackingNumber: 'TRK-9', note: '' },
      ],
    },
    'POST /api/labs/[labId]/revisions/[revisionId]/as-built': {
      client: fabricator,
      params: { revisionId: s.released.revisionId },
      templates: [
        {
          depths: [{ layerId: 'ch50', depthUm: 52 }],
          widths: [{ elementId: 'tj-1', field: 'mainWidth', widthUm: 97 }],
          note: 'profilometer',
        },
        { widths: [{ elementId: 'oil-feed', field: 'width', widthUm: 101 }] },
      ],
    },
    'POST /api/labs/[labId]/revisions/[revisionId]/as-built/[asBuiltId]/files': {
      client: fabricator,
      params: { revisionId: s.released.revisionId },
      templates: [{}],
    },
    'POST /api/labs/[labId]/orders/[orderId]/messages': {
      client: fabricator,
      templates: [{ body: 'Wafer two is cracked: remake on Monday?' }],
    },
    'POST /api/labs/[labId]/revisions/[revisionId]/release': {
      client: admin,
      params: { revisionId: s.toRelease.revisionId },
      templates: [
        { note: 'go' },
        {
          note: 'go',
          order: {
            quantity: 4,
            substrate: 'glass',
            maskPolarity: 'negative',
            maskMedium: 'chrome',
            dueDate: '2027-02-01',
            poNumber: 'PO-1',
            notes: 'n',
          },
        },
      ],
    },
    // Options travel in the query (as on GET …/dxf); whatever body comes is ignored, never a 5xx.
    'POST /api/labs/[labId]/revisions/[revisionId]/dxf-exports': { client: admin, templates: [{}, { mirror: 'true' }] },
    'POST /api/labs/[labId]/revisions/[revisionId]/review-requests': {
      client: admin,
      templates: [{ reviewerIds: [s.people[2]!.id, s.people[0]!.id] }],
    },
    'POST /api/labs/[labId]/revisions/[revisionId]/threads': {
      client: admin,
      templates: [{ anchor: { x: 100, y: 200, elementId: 'tj-1' }, body: 'Is this *wide* enough?' }],
    },
    'PATCH /api/labs/[labId]/revisions/[revisionId]/threads/[threadId]': {
      client: admin,
      templates: [{ resolved: true }, { resolved: false }],
    },
    'POST /api/labs/[labId]/revisions/[revisionId]/threads/[threadId]/comments': {
      client: admin,
      templates: [{ body: 'A reply with **Markdown**' }],
    },
    'POST /api/labs/[labId]/revisions/[revisionId]/verdicts': {
      client: admin,
      templates: [{ verdict: 'approve', note: 'fine' }, { verdict: 'request-changes' }],
    },
    'POST /api/labs/[labId]/revisions/[revisionId]/bench-runs': {
      client: admin,
      templates: [
        {
          source: 'typed',
          values: [48.2, 49.9, 51.1],
          unit: 'um',
          operatingPointId: 'op-1',
          conditions: { continuousFlow: { value: 10, unit: 'uL/min' }, dispersedFlow: { value: 2, unit: 'uL/min' } },
          notes: 'n',
        },
        { source: 'csv', csv: { text: 'diameter\n50.1\n49.7\n', column: 'diameter', unit: 'um' } },
      ],
    },
    'POST /api/labs/[labId]/bench-runs/[runId]/micrographs': { client: admin, templates: [{ umPerPx: 0.8 }] },
    'PATCH /api/labs/[labId]/bench-runs/[runId]/micrographs/[micrographId]': {
      client: admin,
      templates: [{ excluded: [1, 2] }],
    },
    'PUT /api/labs/[labId]/calibrations/forecast-mode': {
      client: admin,
      templates: [
        { designId: s.main.designId, mode: 'lab-calibrated' },
        { designId: s.main.designId, mode: 'model' },
      ],
    },
    'POST /api/labs/[labId]/libraries': {
      client: admin,
      templates: [
        { ...LAB_LIQUID, key: 'fuzz-oil' },
        {
          kind: 'pair',
          liquids: ['water', 'lab-fuzz-oil'],
          surfactant: 'fuzz-surfactant',
          interfacialTensionMNPerM: 4.2,
          source: 'measured in our lab',
        },
        {
          kind: 'process',
          key: 'fuzz-process',
          name: 'Fuzz process',
          material: 'PDMS',
          minFeature: 10,
          minGap: 10,
          minDepth: 5,
          maxDepth: 100,
          maxWidthToDepth: 15,
          maxWallDepthToWidth: 4,
          portEdgeDistance: 1000,
          portSpacing: 1000,
          bondPressureLimitMbar: 1500,
          source: 'measured in our lab',
        },
      ],
    },
    'PATCH /api/labs/[labId]/libraries/[entryId]': {
      client: admin,
      templates: [
        {
          kind: 'liquid',
          name: 'Fuzz oil, new lot',
          source: 'measured in our lab',
          table: [{ temperatureC: 20, viscosityMPaS: 5, densityKgPerM3: 900 }],
        },
      ],
    },
    'POST /api/labs/[labId]/libraries/[entryId]/archive': {
      client: admin,
      templates: [{ archived: true }, { archived: false }],
    },
    'POST /api/v1/forecast': {
      client: admin,
      templates: [
        forecastExample,
        {
          network: {
            channels: [channel('a', 'in', 'mid'), channel('b', 'mid', 'out')],
            sources: [
              { node: 'in', pressure: '100 mbar' },
              { node: 'out', pressure: '0 mbar' },
            ],
            liquid: { liquid: 'water' },
          },
        },
        { document: s.doc, operatingPoint: 'op-1' },
      ],
    },
    'POST /api/v1/plan': {
      client: admin,
      templates: [
        {
          ...planJunction,
          target: { dropletDiameter: '40 um', tolerance: 0.05, minFrequency: '500 Hz' },
          search: { continuous: ['0.1 uL/min', '100 uL/min'], dispersed: ['0.1 uL/min', '100 uL/min'], points: 4 },
          encapsulation: { concentration: '2e6 /mL' },
          run: { minutes: 10 },
          digital: { partitions: 20000, positives: 4000 },
        },
        {
          document: s.doc,
          operatingPoint: 'op-1',
          target: { dropletVolume: '30 pL' },
          search: { points: 3 },
          process: 'film-mask-soft-litho',
        },
      ],
    },
  }
  const p = plans[`${route.method} ${route.template}`]
  if (!p) return null
  return { client: p.client, path: fill(route.template, { ...params, ...p.params }), arbitrary: bodies(p.templates) }
}

// ---------------------------------------------------------------------------------------------------------------

async function send(
  client: ApiClient,
  method: string,
  path: string,
  body: Body,
): Promise<{ status: number; text: string }> {
  const headers: Record<string, string> = { 'content-type': 'application/json' }
  if (client.cookies.size) headers.cookie = [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
  const text = 'raw' in body ? body.raw : JSON.stringify(body.json)
  try {
    const res = await fetch(client.baseURL + path, {
      method,
      headers,
      body: text,
      redirect: 'manual',
      signal: AbortSignal.timeout(REQUEST_MS),
    })
    return { status: res.status, text: (await res.text()).slice(0, 300) }
  } catch (error) {
    return { status: 599, text: `no answer: ${(error as Error).message}` } // a time-out or a dropped connection
  }
}

interface Finding {
  route: string
  status: number
  answer: string
  first: string
  shrunk: string
  count: number
}

async function pool<T>(items: T[], width: number, work: (item: T) => Promise<void>) {
  let next = 0
  await Promise.all(
    Array.from({ length: width }, async () => {
      while (next < items.length) await work(items[next++]!)
    }),
  )
}

beforeAll(async () => {
  started = new Date()
  server = await startServer({ databaseUrl: inject('databaseUrl'), name: 'api-fuzz' })
  setup = await setUp(server.baseURL)
}, 120_000)

afterAll(async () => {
  await server?.stop()
  // The fuzzed sign-ins are failures from 127.0.0.1: forget them, so later test files can still sign in.
  const client = new pg.Client({ connectionString: inject('databaseUrl') })
  await client.connect()
  await client.query('delete from sign_in_failures where at >= $1', [started])
  await client.end()
})

describe('fuzzing every write route', () => {
  it(`answers no generated body with 5xx (${RUNS_PER_ROUTE} bodies per route, ${CONCURRENCY} at a time)`, async () => {
    const routes = apiRoutes().filter(isWrite)
    const missing = routes.filter(r => !plan(r, setup)).map(r => `${r.method} ${r.template}`)
    expect(missing, 'every write route needs a fuzz plan (valid bodies to start from)').toEqual([])

    let sent = 0
    const statuses: Record<number, number> = {}
    const findings: Finding[] = []
    const timing: Record<string, { total: number; max: number; body: string }> = {}
    const t0 = performance.now()
    await pool(routes, CONCURRENCY, async route => {
      const { client, path, arbitrary } = plan(route, setup)!
      const name = `${route.method} ${route.template}`
      let first: { body: Body; status: number; answer: string } | null = null
      let count = 0
      const result = await fc.check(
        fc.asyncProperty(arbitrary, async body => {
          const t = performance.now()
          const res = await send(client, route.method, path, body)
          const ms = performance.now() - t
          const time = (timing[name] ??= { total: 0, max: 0, body: '' })
          time.total += ms
          if (ms > time.max) Object.assign(time, { max: ms, body: show(body).slice(0, 160) })
          sent++
          statuses[res.status] = (statuses[res.status] ?? 0) + 1
          if (res.status < 500) return true
          count++
          first ??= { body, status: res.status, answer: res.text }
          return false
        }),
        { numRuns: RUNS_PER_ROUTE, seed: SEED, interruptAfterTimeLimit: 40_000 },
      )
      if (result.failed && first) {
        const shrunk = result.counterexample ? show(result.counterexample[0]) : '(not shrunk)'
        const f = first as { body: Body; status: number; answer: string }
        findings.push({ route: name, status: f.status, answer: f.answer, first: show(f.body), shrunk, count })
      }
    })
    const seconds = (performance.now() - t0) / 1000
    console.info(
      `[fuzz] ${sent} bodies to ${routes.length} write routes in ${seconds.toFixed(1)} s; answers by status: ${JSON.stringify(statuses)}`,
    )
    for (const [route, t] of Object.entries(timing)
      .sort((a, b) => b[1].total - a[1].total)
      .slice(0, 3)) {
      console.info(
        `[fuzz] slowest: ${route} ${(t.total / 1000).toFixed(1)} s in all, longest ${(t.max / 1000).toFixed(2)} s for ${t.body}`,
      )
    }
    for (const f of findings) {
      console.info(
        `[fuzz] ${f.route}: ${f.count}× ≥ 500 (first ${f.status}: ${f.answer.replace(/\s+/g, ' ')})\n  first body:  ${f.first}\n  shrunk body: ${f.shrunk}`,
      )
    }
    expect(findings.map(f => `${f.route} answered ${f.status} to ${f.shrunk}`)).toEqual([])
    // Every run happened (a failing route stops at its first failure to shrink it).
    expect(sent).toBeGreaterThanOrEqual(Math.min(2000, RUNS_PER_ROUTE * routes.length))
  }, 240_000)
})
