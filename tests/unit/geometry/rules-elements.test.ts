import { describe, expect, it } from 'vitest'
import { parseChipDocument } from '#shared/schemas/chip'
import { exportDxf } from '~~/geometry/dxf'
import { BUILT_IN_PROCESSES, checkDesignRules } from '~~/geometry/rules'
import { loadDocumentFixture } from '../schemas/load-fixture'
import { channelsDoc, moved, parsed } from './helpers'

// Values from geometry/rules/processes.ts (common practice, no source) and the citations beside each rule.
const film = BUILT_IN_PROCESSES.find(p => p.id === 'film-mask-soft-litho')!
const rules = (fs: { rule: string; elements: string[] }[]) => fs.map(f => `${f.rule} ${f.elements.join('+')}`)

describe('bad geometry gives a finding or a validation error naming the element, never an exception', () => {
  it('zero width and NaN are validation errors naming the channel', () => {
    const doc = loadDocumentFixture('t-junction-basic.json')
    doc.channels[0].width = 0
    doc.channels[1].points[0].y = Number.NaN
    const r = parseChipDocument(doc)
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.errors.map(e => e.element?.id)).toEqual(['oil-feed', 'water-feed'])
  })
  it('self-crossing channel: an error finding, and the DXF still exports the rest', () => {
    const doc = channelsDoc([
      {
        id: 'knot',
        layerId: 'L',
        width: 50,
        points: [
          { x: 1000, y: 1000 },
          { x: 3000, y: 1000 },
          { x: 3000, y: 3000 },
          { x: 2000, y: 0 },
        ],
      },
    ])
    expect(rules(checkDesignRules(doc, film))).toContain('self-crossing knot')
    expect(exportDxf(doc, { date: 'd' })).toMatch(/EOF\s*$/)
  })
  it('element outside the chip outline', () => {
    const doc = channelsDoc([
      {
        id: 'stray',
        layerId: 'L',
        width: 50,
        points: [
          { x: 9000, y: 5000 },
          { x: 12000, y: 5000 },
        ],
      },
    ])
    const f = checkDesignRules(doc, film).filter(x => x.rule === 'outside-outline')
    expect(f.map(x => [x.elements, x.severity])).toEqual([[['stray'], 'error']])
    expect(f[0]!.location.x).toBeGreaterThan(10000)
  })
})

describe('process rules', () => {
  const base = loadDocumentFixture('t-junction-basic.json')
  it('wide shallow channel warns of roof collapse (width/depth > 20)', () => {
    const doc = structuredClone(base)
    doc.layers[0].depth = 5
    doc.channels[0].width = 101
    expect(rules(checkDesignRules(parsed(doc), film))).toContain('roof-collapse oil-feed')
  })
  it('ports too close to each other and to the edge', () => {
    const doc = structuredClone(base)
    doc.ports[1].position = { x: 2600, y: 3000 } // 2600 − 1500 − 750 = 350 µm edge to edge
    doc.channels[1].points[0] = { x: 2600, y: 3000 }
    doc.ports[2].position = { x: 9300, y: 3000 }
    doc.channels[2].points[1] = { x: 9300, y: 3000 }
    const r = rules(checkDesignRules(parsed(doc), film))
    expect(r).toContain('port-spacing oil-in+water-in')
    expect(r).toContain('port-edge out')
  })
  it('channel end away from its terminal', () => {
    const doc = structuredClone(base)
    doc.channels[0].points[1] = { x: 4790, y: 3000 }
    expect(rules(checkDesignRules(parsed(doc), film))).toContain('terminal-mismatch oil-feed+tj-1')
  })
  it('pressure above the bond limit is an error; silicone oil swells PDMS', () => {
    const doc = structuredClone(base)
    doc.operatingPoints[0].inlets[0] = { portId: 'oil-in', mode: 'pressure', value: 35, unit: 'psi' } // 2413 mbar
    doc.operatingPoints[0].continuousLiquid = { liquid: 'silicone-oil-10cst' }
    const fs = checkDesignRules(parsed(doc), film)
    expect(fs.find(f => f.rule === 'bond-pressure')?.severity).toBe('error')
    expect(fs.find(f => f.rule === 'solvent-continuous')?.message).toMatch(/Lee, Park & Whitesides 2003/)
  })
  it('step nozzle: no step, and a narrow nozzle', () => {
    const doc = parsed({
      version: 1,
      name: 's',
      units: 'um',
      layers: [
        { id: 'n', name: 'n', depth: 10 },
        { id: 'd', name: 'd', depth: 10 },
      ],
      components: [
        {
          id: 'sn',
          kind: 'step-nozzle',
          position: { x: 5000, y: 5000 },
          layerId: 'n',
          reservoirLayerId: 'd',
          nozzleWidth: 25,
          nozzleLength: 100,
          reservoirWidth: 150,
          reservoirLength: 400,
        },
      ],
      outline: { kind: 'rectangle', corner: { x: 0, y: 0 }, width: 10000, height: 10000 },
    })
    const r = rules(checkDesignRules(doc, film))
    expect(r).toContain('step-no-step sn')
    expect(r).toContain('step-nozzle-aspect sn')
  })
})

// Slips seen on screen that the rules used to pass silently.
describe('geometry slips', () => {
  const base = loadDocumentFixture('t-junction-basic.json')
  it('a 100 µm channel onto the 50 µm dispersed arm of a T-junction warns of a width step there', () => {
    const doc = structuredClone(base)
    doc.channels[1].width = 100
    const f = checkDesignRules(parsed(doc), film).filter(x => x.rule === 'terminal-width-step')
    expect(f.map(x => [x.elements, x.severity])).toEqual([[['water-feed', 'tj-1'], 'warning']])
    expect(f[0]!.message).toContain('100 µm wide where it joins terminal "dispersed" of "tj-1", which is 50 µm wide')
    const end = doc.channels[1].points.at(-1)
    expect(f[0]!.location).toEqual({ x: end.x, y: end.y })
  })
  it('matching widths, ports of any size and a 1 % round-off give no width step', () => {
    const doc = structuredClone(base)
    doc.channels[1].width = 50.5
    expect(rules(checkDesignRules(parsed(doc), film)).filter(r => r.startsWith('terminal-width-step'))).toEqual([])
  })
  const crossingPair = () =>
    channelsDoc([
      {
        id: 'a',
        layerId: 'L',
        width: 50,
        points: [
          { x: 1000, y: 2000 },
          { x: 6000, y: 2000 },
          { x: 6000, y: 8000 },
        ],
      },
      {
        id: 'b',
        layerId: 'L',
        width: 50,
        points: [
          { x: 8000, y: 5000 },
          { x: 3000, y: 5000 },
        ],
      },
    ])
  it('two channels crossing after a turn on one layer are an error located at the crossing', () => {
    const f = checkDesignRules(crossingPair(), film).filter(x => x.rule === 'channel-crossing')
    expect(f.map(x => [x.elements, x.severity])).toEqual([[['a', 'b'], 'error']])
    expect(f[0]!.location.x).toBeCloseTo(6000, 6)
    expect(f[0]!.location.y).toBeCloseTo(5000, 6)
  })
  it('the crossing is found on the moved and rotated chip too, at the moved point', () => {
    const f = checkDesignRules(moved(crossingPair(), 37, { x: 400, y: -300 }), film).filter(
      x => x.rule === 'channel-crossing',
    )
    const expected = moved(
      channelsDoc([
        {
          id: 'p',
          layerId: 'L',
          width: 50,
          points: [
            { x: 6000, y: 5000 },
            { x: 6100, y: 5000 },
          ],
        },
      ]),
      37,
      { x: 400, y: -300 },
    ).channels[0]!.points[0]!
    expect(f).toHaveLength(1)
    expect(f[0]!.location.x).toBeCloseTo(expected.x, 6)
    expect(f[0]!.location.y).toBeCloseTo(expected.y, 6)
  })
  it('channels that only meet end to end, or cross on different layers, are not crossings', () => {
    const touching = channelsDoc([
      {
        id: 'a',
        layerId: 'L',
        width: 50,
        points: [
          { x: 1000, y: 2000 },
          { x: 6000, y: 2000 },
        ],
      },
      {
        id: 'b',
        layerId: 'L',
        width: 50,
        points: [
          { x: 6000, y: 2000 },
          { x: 6000, y: 7000 },
        ],
      },
    ])
    expect(rules(checkDesignRules(touching, film)).filter(r => r.startsWith('channel-crossing'))).toEqual([])
    const twoLayers = parsed({
      ...crossingPair(),
      layers: [
        { id: 'L', name: 'L', depth: 50 },
        { id: 'M', name: 'M', depth: 50 },
      ],
      channels: crossingPair().channels.map(c => (c.id === 'b' ? { ...c, layerId: 'M' } : c)),
    })
    expect(rules(checkDesignRules(twoLayers, film)).filter(r => r.startsWith('channel-crossing'))).toEqual([])
  })
})
