import { spawn } from 'node:child_process'
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import example from '../fixtures/plan/t-junction-plan.json' // the example of docs/planner.md

const QUANTITY = {
  value: expect.any(Number),
  unit: expect.any(String),
  method: expect.any(String),
  source: expect.any(String),
  valid: expect.any(Boolean),
}

describe('POST /api/v1/plan and npm run plan (real server)', () => {
  it('answers the documented example: window, recommended point with a reason, geometry and loading, every number a cited quantity', async () => {
    const api = await signedIn('designer@quillmere.example')
    const res = await api.post('/api/v1/plan', example)
    expect(res.status).toBe(200)
    const { window, recommended, geometry, encapsulation } = res.json
    expect(window.points.length).toBe(625)
    expect(window.points[0]).toMatchObject({
      flow: { continuous: QUANTITY, dispersed: QUANTITY },
      dropletDiameter: QUANTITY,
      frequency: QUANTITY,
      regime: expect.any(String),
      valid: expect.any(Boolean),
    })
    expect(recommended).toMatchObject({
      flow: { continuous: QUANTITY, dispersed: QUANTITY },
      dropletDiameter: QUANTITY,
      frequency: QUANTITY,
      reason: expect.any(String),
    })
    expect(Math.abs(recommended.dropletDiameter.value - 40e-6)).toBeLessThanOrEqual(2e-6)
    expect(recommended.frequency.value).toBeGreaterThanOrEqual(500)
    expect(geometry.map((g: { kind: string }) => g.kind)).toEqual(['t-junction', 'flow-focusing', 'step'])
    for (const g of geometry)
      expect(g).toMatchObject({
        junction: { mainWidth: QUANTITY, depth: QUANTITY },
        law: { method: expect.any(String), source: expect.any(String) },
      })
    for (const key of ['lambda', 'empty', 'single', 'multiple', 'cellsPerHour'])
      expect(encapsulation[key], key).toMatchObject(QUANTITY)
    // λ = c V with c = 2e6 /mL and V the recommended drop's volume (Collins et al. 2015)
    expect(encapsulation.lambda.value).toBeCloseTo(2e12 * (Math.PI / 6) * recommended.dropletDiameter.value ** 3, 8)
  })

  it('answers a chip document of the caller with its inlet settings', async () => {
    const api = await signedIn('designer@quillmere.example')
    const doc = JSON.parse(readFileSync('tests/fixtures/documents/t-junction-basic.json', 'utf8'))
    const res = await api.post('/api/v1/plan', {
      document: doc,
      target: { dropletVolume: '60 pL', tolerance: 0.1 },
      search: { points: 8 },
    })
    expect(res.status, JSON.stringify(res.json).slice(0, 300)).toBe(200)
    expect(res.json.window.points.length).toBe(64)
    if (res.json.recommended) expect(res.json.recommended.inlets.length).toBeGreaterThan(0)
    else expect(res.json.unreachable.reason).toEqual(expect.any(String))
  })

  it('answers 400 naming the field, and 401 without a session', async () => {
    const api = await signedIn('experimenter@quillmere.example')
    const bad = await api.post('/api/v1/plan', { ...example, target: { ...example.target, dropletDiameter: '40 kg' } })
    expect(bad.status).toBe(400)
    expect(bad.json.data.issues.map((i: { path: string }) => i.path)).toContain('target.dropletDiameter')
    const concentration = await api.post('/api/v1/plan', { ...example, encapsulation: { concentration: 'many' } })
    expect(concentration.status).toBe(400)
    expect(JSON.stringify(concentration.json.data.issues)).toContain('encapsulation.concentration')
    expect((await new ApiClient().post('/api/v1/plan', example)).status).toBe(401)
  })

  it('the command line: the same answer on stdout, exit 2 with the field on stderr', async () => {
    // The three runs start together (each one starts tsx, slow on a busy machine).
    const [ok, bad, notJson] = await Promise.all([
      runPlan(JSON.stringify({ ...example, search: { points: 5 } })),
      runPlan(JSON.stringify({ ...example, target: { dropletDiameter: '40 um', tolerance: 3 } })),
      runPlan('{'),
    ])
    expect(ok.status, ok.stderr).toBe(0)
    expect(JSON.parse(ok.stdout).window.points).toHaveLength(25)
    expect(bad.status).toBe(2)
    expect(bad.stderr).toMatch(/target\.tolerance/)
    expect(notJson.status).toBe(2)
  }, 120_000)

  it("the command line plans on a lab's own process from --process-file, and names a bad value in it", async () => {
    // Invented values: a coarse process whose smallest feature is 40 µm.
    const coarse = {
      id: 'lab-coarse',
      name: 'Our coarse milling process',
      material: 'thermoplastic',
      minFeature: 40,
      minGap: 40,
      minDepth: 20,
      maxDepth: 300,
      maxWidthToDepth: 10,
      maxWallDepthToWidth: 3,
      portEdgeDistance: 1500,
      portSpacing: 1500,
      bondPressureLimitMbar: 3000,
      source: 'measured in our lab',
    }
    const dir = mkdtempSync(join(tmpdir(), 'dw-plan-'))
    writeFileSync(join(dir, 'good.json'), JSON.stringify([coarse]))
    writeFileSync(join(dir, 'bad.json'), JSON.stringify([{ ...coarse, minFeature: -1 }]))
    const request = JSON.stringify({ ...example, search: { points: 4 }, process: 'lab-coarse' })
    const [ok, without, bad] = await Promise.all([
      runPlan(request, [`--process-file=${join(dir, 'good.json')}`]),
      runPlan(request),
      runPlan(request, [`--process-file=${join(dir, 'bad.json')}`]),
    ])
    expect(ok.status, ok.stderr).toBe(0)
    for (const g of JSON.parse(ok.stdout).geometry)
      expect(g.process).toMatchObject({ id: 'lab-coarse', name: 'Our coarse milling process' })
    expect(without.status).toBe(2)
    expect(without.stderr).toMatch(/process: "lab-coarse" is not a fabrication process here .*--process-file/)
    expect(bad.status).toBe(2)
    expect(bad.stderr).toContain('--process-file: [0].minFeature: Smallest feature must be above 0 µm')
  }, 120_000)
})

/** `npm run --silent plan [-- args] < input`, run as the script does (the project's own tsx, no npx lookup). */
function runPlan(
  input: string,
  args: string[] = [],
): Promise<{ status: number | null; stdout: string; stderr: string }> {
  return new Promise(resolve => {
    const child = spawn('node_modules/.bin/tsx', ['scripts/plan.ts', ...args])
    let stdout = ''
    let stderr = ''
    child.stdout.on('data', c => (stdout += c))
    child.stderr.on('data', c => (stderr += c))
    child.on('close', status => resolve({ status, stdout, stderr }))
    child.stdin.end(input)
  })
}
