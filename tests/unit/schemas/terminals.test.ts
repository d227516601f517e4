import { describe, expect, it } from 'vitest'
import { component, componentTerminals, serpentineRunLength } from '#shared/schemas/chip'
import type { Component } from '#shared/schemas/chip'

// Source: the local terminal table in shared/schemas/chip/terminals.ts and 2D rotation (elementary geometry).
const base = { position: { x: 1000, y: 2000 }, layerId: 'L' }
const kinds: Component[] = [
  component.parse({ ...base, id: 't', kind: 't-junction', mainWidth: 100, inletWidth: 50, armLength: 200 }),
  component.parse({
    ...base,
    id: 'f',
    kind: 'flow-focusing',
    orificeWidth: 30,
    orificeLength: 60,
    continuousWidth: 80,
    dispersedWidth: 60,
    outletWidth: 120,
    armLength: 300,
  }),
  component.parse({
    ...base,
    id: 'y',
    kind: 'y-junction',
    angle: 60,
    continuousWidth: 80,
    dispersedWidth: 60,
    outletWidth: 100,
    armLength: 300,
  }),
  component.parse({
    ...base,
    id: 's',
    kind: 'step-nozzle',
    reservoirLayerId: 'D',
    nozzleWidth: 20,
    nozzleLength: 100,
    reservoirWidth: 300,
    reservoirLength: 400,
  }),
  component.parse({
    ...base,
    id: 'a',
    kind: 'step-array',
    supplyLayerId: 'D',
    reservoirLayerId: 'D',
    nozzleCount: 8,
    pitch: 60,
    nozzleWidth: 20,
    nozzleLength: 100,
    supplyWidth: 200,
    reservoirWidth: 300,
    margin: 100,
  }),
  component.parse({ ...base, id: 'r', kind: 'serpentine', turns: 3, pitch: 200, width: 50, totalLength: 5000 }),
]

describe('component terminals', () => {
  it('T-junction terminals sit at the arm ends', () => {
    const t = componentTerminals(kinds[0]!)
    expect(t.map(x => [x.name, x.position.x, x.position.y])).toEqual([
      ['continuous', 800, 2000],
      ['dispersed', 1000, 2200],
      ['outlet', 1200, 2000],
    ])
  })
  it('rotating a component by 90° rotates every terminal about its position', () => {
    for (const c of kinds) {
      const turned = componentTerminals({ ...c, rotation: 90 })
      componentTerminals(c).forEach((t, i) => {
        const dx = t.position.x - c.position.x
        const dy = t.position.y - c.position.y
        expect(turned[i]!.position.x).toBeCloseTo(c.position.x - dy, 9)
        expect(turned[i]!.position.y).toBeCloseTo(c.position.y + dx, 9)
        expect(turned[i]!.direction.x).toBeCloseTo(-t.direction.y, 12)
      })
    }
  })
  it('serpentine run length adds back to the total length', () => {
    const s = kinds[5]! as Extract<Component, { kind: 'serpentine' }>
    const run = serpentineRunLength(s)
    expect(run * 4 + 3 * Math.PI * 100).toBeCloseTo(5000, 9)
    const out = componentTerminals(s)[1]!
    expect(out.position).toEqual({ x: 1000, y: 2600 }) // odd turns: ends back at x = 0, three pitches up
  })
})
