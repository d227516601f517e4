// The planner checks its geometry against the lab's own process when the caller brings its lab's library, and
// refuses a lab process id it was not given (another lab's, or no lab named) with the field and what to use.
import { describe, expect, it } from 'vitest'
import { ForecastInputError } from '../../../shared/physics/forecast'
import { runPlan } from '../../../shared/physics/planner'
import type { LabProcessData } from '../../../geometry/rules'

// Invented values: a coarse process whose smallest feature is 40 µm (the built-in film mask: 20 µm).
const COARSE: LabProcessData = {
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
const lab = { liquids: [], pairs: [], processes: [COARSE] }
const request = {
  junction: { kind: 't-junction', mainWidth: '100 um', inletWidth: '50 um', depth: '50 um' },
  continuous: { liquid: 'hydrofluoroether' },
  dispersed: { liquid: 'water' },
  interfacialTension: '3 mN/m',
  target: { dropletDiameter: '25 um' },
  search: { points: 5 },
  process: 'lab-coarse',
}
const refusal = (fn: () => unknown) => {
  try {
    fn()
    return null
  } catch (e) {
    return e instanceof ForecastInputError ? e.issues : e
  }
}

describe('planner on a lab process', () => {
  it("sizes and checks each junction kind against the lab's own values", () => {
    const plan = runPlan(request, { lab })
    expect(plan.geometry.length).toBeGreaterThan(0)
    for (const g of plan.geometry)
      expect(g.process).toMatchObject({ id: 'lab-coarse', name: 'Our coarse milling process' })
    // A 25 µm drop needs a 22 µm orifice and a 6.25 µm deep step (d ≈ 4h): fine on the film mask, not on this process.
    const kind = (plan: ReturnType<typeof runPlan>, k: string) => plan.geometry.find(g => g.kind === k)!.process
    expect(kind(plan, 'flow-focusing').problems).toContain(
      "orifice width 22 µm is below the process's minimum feature of 40 µm",
    )
    expect(kind(plan, 'step').problems).toContain("depth 6.25 µm is below the process's 20 µm")
    const onFilm = runPlan({ ...request, process: 'film-mask-soft-litho' }, { lab })
    expect(onFilm.geometry.every(g => g.process.id === 'film-mask-soft-litho')).toBe(true)
    expect(kind(onFilm, 'flow-focusing')).toMatchObject({ ok: true, problems: [] })
    expect(kind(onFilm, 'step')).toMatchObject({ ok: true, problems: [] })
  })

  it('refuses a lab process it was not given, naming the field and listing only what the caller may use', () => {
    const unnamed = refusal(() => runPlan(request)) as Array<{ path: string; message: string }>
    expect(unnamed).toEqual([
      {
        path: 'process',
        message: expect.stringContaining(
          '"lab-coarse" is not a fabrication process here (a lab\'s own process needs its lab: POST /api/v1/plan?lab=<lab id>, or npm run plan -- --process-file=<file>)',
        ),
      },
    ])
    const other = refusal(() => runPlan({ ...request, process: 'lab-theirs' }, { lab })) as Array<{
      path: string
      message: string
    }>
    expect(other[0]!.path).toBe('process')
    expect(other[0]!.message).toBe(
      '"lab-theirs" is not a fabrication process here: use one of "film-mask-soft-litho", "chrome-mask-soft-litho", "lab-coarse"',
    )
    const bad = refusal(() => runPlan({ ...request, process: 'Lab Coarse!' }, { lab })) as Array<{ path: string }>
    expect(bad[0]!.path).toBe('process')
  })
})
