import DxfParser from 'dxf-parser'
import { describe, expect, it } from 'vitest'
import { ezdxfReport } from '../../support/ezdxf'
import { bezierSegments, exportDxf, flattenGlyph, TEXT_CHORD_TOLERANCE_UM } from '~~/geometry/dxf'
import { signedArea } from '~~/geometry/vec'
import type { Pair } from '~~/geometry/types'
import { labelFont } from '~~/server/utils/labelFont'
import { loadDocumentFixture } from '../schemas/load-fixture'
import { parsed } from './helpers'

// The chip label as closed outlines on the TEXT layer (issue 16 item 11), read back with dxf-parser and with
// Debian's python3-ezdxf. The label "HEIL 17" has only flat tops and bottoms (no round overshoot), so its
// outlines span exactly the cap height: the requested text height, as a DXF TEXT entity's height is.
type Entity = { type: string; layer: string; shape?: boolean; text?: string; vertices: { x: number; y: number }[] }
const parse = (s: string) => new DxfParser().parseSync(s) as unknown as { entities: Entity[] }

const LABEL = { x: 6500, y: 500, height: 400, text: 'HEIL 17' }
const base = loadDocumentFixture('t-junction-basic.json') as { marks: unknown[] } & Record<string, unknown>
const doc = parsed({
  ...base,
  marks: [
    ...base.marks.filter(m => (m as { kind: string }).kind !== 'text'),
    {
      id: 'label',
      kind: 'text',
      position: { x: LABEL.x, y: LABEL.y },
      text: LABEL.text,
      height: LABEL.height,
      layerIds: [],
    },
  ],
})
const font = labelFont()
const outlined = (mirror = false) => exportDxf(doc, { font, mirror, revision: 'r2', date: '2026-03-01' })
const ring = (e: Entity): Pair[] => e.vertices.map(v => [v.x, v.y])
// the label sits inside the chip (y ≥ 0); the title block is written below the chip outline
const labelLoops = (es: Entity[]) =>
  es.filter(e => e.layer === 'TEXT' && e.type === 'LWPOLYLINE' && e.vertices.every(v => v.y >= 0))

describe('mask DXF text as outlines (default)', () => {
  it('has no TEXT or MTEXT entity and closed polylines on the TEXT layer', () => {
    const es = parse(outlined()).entities
    expect(es.filter(e => e.type === 'TEXT' || e.type === 'MTEXT')).toHaveLength(0)
    const onText = es.filter(e => e.layer === 'TEXT')
    expect(onText.length).toBeGreaterThan(0)
    expect(onText.every(e => e.type === 'LWPOLYLINE' && e.shape === true && e.vertices.length >= 3)).toBe(true)
  })

  it('the label spans the requested height and sits on its baseline (within chord tolerance + 1 nm)', () => {
    for (const mirror of [false, true]) {
      const ys = labelLoops(parse(outlined(mirror)).entities).flatMap(e => e.vertices.map(v => v.y))
      const tol = TEXT_CHORD_TOLERANCE_UM + 1e-3
      expect(Math.abs(Math.min(...ys) - LABEL.y)).toBeLessThan(tol)
      expect(Math.abs(Math.max(...ys) - Math.min(...ys) - LABEL.height)).toBeLessThan(tol)
    }
  })

  it('outer loops run counter-clockwise, holes clockwise, also mirrored ("ABOD": four outers, five holes)', () => {
    const holed = parsed({
      ...base,
      marks: [{ id: 'label', kind: 'text', position: { x: 1000, y: 500 }, text: 'ABOD', height: 400, layerIds: [] }],
    })
    for (const mirror of [false, true]) {
      const loops = labelLoops(parse(exportDxf(holed, { font, mirror, date: 'x' })).entities).map(ring)
      const outer = loops.filter(r => signedArea(r) > 0)
      const holes = loops.filter(r => signedArea(r) < 0)
      expect(outer).toHaveLength(4) // A, B, O, D: one outer boundary each
      expect(holes).toHaveLength(5) // A 1, B 2, O 1, D 1
    }
  })

  it('the font option brings back exactly one TEXT entity for the label (plus the four title-block lines)', () => {
    const es = parse(exportDxf(doc, { font, text: 'font', revision: 'r2', date: '2026-03-01' })).entities
    const texts = es.filter(e => e.type === 'TEXT')
    expect(texts.filter(e => e.text === LABEL.text)).toHaveLength(1)
    expect(texts).toHaveLength(5)
    expect(labelLoops(es)).toHaveLength(0)
  })

  it('read back by ezdxf: audit clean, no TEXT/MTEXT, every polyline on TEXT closed', () => {
    const out = ezdxfReport<{ polylines: number }>(outlined(true), [
      'pl = msp.query(\'LWPOLYLINE[layer=="TEXT"]\')',
      'print(json.dumps({"errors": len(auditor.errors), "text": len(msp.query("TEXT MTEXT")), "polylines": len(pl), "open": sum(1 for e in pl if not e.closed)}))',
    ])
    expect(out).toMatchObject({ errors: 0, text: 0, open: 0 })
    expect(out.polylines).toBeGreaterThan(10)
  })
})

describe("Bézier flattening (Wang's formula, uniform subdivision)", () => {
  it('a quarter-circle-like quadratic stays within the tolerance at every sample', () => {
    const tol = 0.1
    const ctrl: Pair[] = [
      [0, 0],
      [100, 0],
      [100, 100],
    ]
    const n = bezierSegments(ctrl, tol)
    const pts = flattenGlyph(
      [
        { command: 'moveTo', args: [0, 0] },
        { command: 'quadraticCurveTo', args: [100, 0, 100, 100] },
      ],
      tol,
    )[0]!
    expect(pts).toHaveLength(n + 1)
    // the exact curve at fine steps is never farther than tol from the polyline
    const B = (t: number): Pair => [2 * (1 - t) * t * 100 + t * t * 100, t * t * 100]
    const segDist = (p: Pair, a: Pair, b: Pair) => {
      const dx = b[0] - a[0],
        dy = b[1] - a[1]
      const u = Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / (dx * dx + dy * dy)))
      return Math.hypot(p[0] - a[0] - u * dx, p[1] - a[1] - u * dy)
    }
    let worst = 0
    for (let k = 0; k <= 2000; k++) {
      const p = B(k / 2000)
      let best = Infinity
      for (let i = 0; i + 1 < pts.length; i++) best = Math.min(best, segDist(p, pts[i]!, pts[i + 1]!))
      worst = Math.max(worst, best)
    }
    expect(worst).toBeLessThanOrEqual(tol)
    expect(worst).toBeGreaterThan(tol / 10) // not grossly over-subdivided
  })
})
