import DxfParser from 'dxf-parser'
import { describe, expect, it } from 'vitest'
import { ezdxfReport } from '../../support/ezdxf'
import { multiPolygonArea } from '~~/geometry/area'
import { exportDxf, dxfLayers } from '~~/geometry/dxf'
import { generateParallelChip } from '~~/geometry/arrays'
import { buildOutlines } from '~~/geometry/outlines'
import { signedArea } from '~~/geometry/vec'
import { fixture } from './helpers'

// Checks against independent readers, as issue 4 asks: dxf-parser (npm) and Debian's python3-ezdxf audit.
// $INSUNITS 13 = micrometres (DXF reference, HEADER section variables).
type Entity = { type: string; layer: string; shape?: boolean; vertices: { x: number; y: number }[] }
const parse = (s: string) =>
  new DxfParser().parseSync(s) as unknown as { header: Record<string, unknown>; entities: Entity[] }

function layerAreas(s: string): Map<string, number> {
  const areas = new Map<string, number>()
  for (const e of parse(s).entities) {
    if (e.type !== 'LWPOLYLINE') continue
    const a = signedArea(e.vertices.map(v => [v.x, v.y] as [number, number]))
    areas.set(e.layer, (areas.get(e.layer) ?? 0) + a)
  }
  return areas
}

const docs = {
  't-junction': fixture('t-junction-basic.json'),
  'parallel-48': generateParallelChip({ nozzles: 48, nozzlesPerBank: 24 }),
}

describe('DXF export read back with dxf-parser', () => {
  for (const [name, doc] of Object.entries(docs)) {
    it(`${name}: µm units, closed polylines, per-layer area = merged area within 0.1 %`, () => {
      const o = buildOutlines(doc)
      for (const mirror of [false, true]) {
        const dxf = exportDxf(doc, { outlines: o, mirror, revision: 'r2', date: '2026-03-01' })
        const parsed = parse(dxf)
        expect(parsed.header.$INSUNITS).toBe(13)
        const polylines = parsed.entities.filter(e => e.type === 'LWPOLYLINE')
        expect(polylines.length).toBeGreaterThan(0)
        expect(polylines.every(e => e.shape === true)).toBe(true)
        const areas = layerAreas(dxf)
        for (const l of dxfLayers(o)) {
          const expected = multiPolygonArea(l.polygons)
          expect(Math.abs(Math.abs(areas.get(l.name) ?? 0) - expected) / expected).toBeLessThan(1e-3)
        }
        const texts = parsed.entities.filter(e => e.type === 'TEXT').map(e => (e as unknown as { text: string }).text)
        expect(texts).toContain('Revision: r2')
        expect(texts).toContain('Date: 2026-03-01')
      }
    })
  }
  it('names layers by depth and honours the layer filter', () => {
    const doc = docs['parallel-48']
    const all = new Set(parse(exportDxf(doc, { date: '2026-03-01' })).entities.map(e => e.layer))
    expect([...all].sort()).toEqual(['CH-150um', 'CH-8um', 'MARKS', 'OUTLINE', 'TEXT'])
    const only = new Set(
      parse(exportDxf(doc, { layers: ['nozzle', 'OUTLINE'], date: '2026-03-01' })).entities.map(e => e.layer),
    )
    expect([...only].sort()).toEqual(['CH-8um', 'OUTLINE'])
  })
  it('mirroring reflects x about the chip centre', () => {
    const doc = docs['t-junction']
    const xs = (m: boolean) =>
      parse(exportDxf(doc, { mirror: m, layers: ['OUTLINE'], date: 'x' }))
        .entities.filter(e => e.type === 'LWPOLYLINE')
        .flatMap(e => e.vertices.map(v => v.x))
    expect(
      xs(true)
        .map(x => 10000 - x)
        .sort(),
    ).toEqual(xs(false).sort())
  })
})

describe('DXF export audited by ezdxf (Debian python3-ezdxf)', () => {
  it('audit has no errors, units are µm, every polyline is closed', () => {
    const out = ezdxfReport<{ polylines: number }>(
      exportDxf(docs['parallel-48'], { mirror: true, date: '2026-03-01' }),
      [
        'pl = msp.query("LWPOLYLINE")',
        'print(json.dumps({"errors": len(auditor.errors), "units": doc.header.get("$INSUNITS"), "polylines": len(pl), "open": sum(1 for e in pl if not e.closed)}))',
      ],
    )
    expect(out).toMatchObject({ errors: 0, units: 13, open: 0 })
    expect(out.polylines).toBeGreaterThan(0)
  })
})
