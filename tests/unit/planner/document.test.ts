import { describe, expect, it } from 'vitest'
import { demoDesigns } from '../../../server/db/demo-designs'
import { runForecast, type DocumentForecast } from '../../../shared/physics/forecast'
import { runPlan } from '../../../shared/physics/planner'

const designs = demoDesigns()
const latest = (name: string) => designs.find(d => d.name.startsWith(name))!.revisions.at(-1)!.document

describe('the planner on a chip document', () => {
  it('flow-driven demo T-junction: the recommended inlet settings, applied to the document, give the forecast the plan promised', () => {
    const doc = latest('Cell encapsulation')
    const plan = runPlan({
      document: doc,
      target: { dropletDiameter: '40 um', minFrequency: '500 Hz' },
      process: 'film-mask-soft-litho',
    })
    expect(plan.window.mode).toEqual({ continuous: 'flow', dispersed: 'flow' })
    expect(plan.window.junction).toBe('tj-1')
    const rec = plan.recommended!
    expect(rec.operatingPoint).toBe('op-1')
    expect(rec.inlets!.map(s => s.portId).sort()).toEqual(['oil-in', 'water-in'])
    const applied = structuredClone(doc) as any
    applied.operatingPoints[0].inlets = rec.inlets
    const back = runForecast({ document: applied }) as DocumentForecast
    const f = back.junctions.find(j => j.id === 'tj-1')!.forecast!
    expect(Math.abs(f.dropletDiameter.value - 40e-6) / 40e-6).toBeLessThanOrEqual(0.05)
    expect(f.frequency.value).toBeGreaterThanOrEqual(500)
  })

  it('pressure-driven 64-nozzle ladder: the window is in inlet pressures, through the network', () => {
    const doc = latest('Parallel step emulsifier')
    const plan = runPlan({ document: doc, target: { dropletDiameter: '32 um', tolerance: 0.1 }, search: { points: 5 } })
    expect(plan.window.mode.dispersed).toBe('pressure')
    expect(plan.window.points).toHaveLength(25)
    const sized = plan.window.points.filter(p => p.dropletDiameter)
    expect(sized.length).toBeGreaterThan(0)
    for (const p of sized) expect(p.pressure!.dispersed.unit).toBe('Pa')
    expect(plan.warnings.map(w => w.code)).toContain('pressure-caution')
    // "Use this point" on a pressure-driven chip sets the dispersed inlet's pressure, as the lab writes it.
    const dispersed = plan.recommended!.inlets!.find(s => s.portId.endsWith('disp-in'))!
    expect(dispersed.mode).toBe('pressure')
    expect(dispersed.unit).toBe('mbar')
    expect(String(dispersed.value).length).toBeLessThanOrEqual(8)
  })

  it('bounds the grid of a chip by its size, naming search.points', () => {
    const doc = latest('Parallel step emulsifier')
    expect(() => runPlan({ document: doc, target: { dropletDiameter: '32 um' }, search: { points: 100 } })).toThrow(
      /search\.points|too much for a chip/,
    )
  })

  it('names an unknown junction and a document with errors', () => {
    const doc = latest('Cell encapsulation')
    expect(() => runPlan({ document: doc, junctionId: 'nope', target: { dropletDiameter: '40 um' } })).toThrow(
      /Junction "nope" is not in design/,
    )
    expect(() =>
      runPlan({ document: { ...(doc as object), layers: [] }, target: { dropletDiameter: '40 um' } }),
    ).toThrow()
  })
})
