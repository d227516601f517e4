// Screen-space layout of what sits on top of the chip: junction callouts, review pins and rule findings. Pure:
// positions in CSS pixels from the view, callouts de-cluttered so none overlaps another or a marker.
import { worldPoint, worldToScreen, type View, type ViewportSize } from './viewport'

export type Tone = 'ok' | 'caution' | 'fault'
export type Severity = 'error' | 'warning' | 'info'

export interface ViewerLabel {
  elementId: string
  x: number
  y: number
  lines: string[]
  tone: Tone
}
export interface ViewerPin {
  id: string
  x: number
  y: number
  index: number
  resolved: boolean
  active?: boolean
}
export interface ViewerFinding {
  id: string
  severity: Severity
  x: number
  y: number
  message: string
}
export interface PinAddEvent {
  x: number
  y: number
  elementId?: string
}

export interface Box {
  x: number
  y: number
  w: number
  h: number
}

/** Callout text metrics: JetBrains Mono advances 0.6 em per character. */
export const CALLOUT = { fontPx: 11, charPx: 6.6, linePx: 14, padX: 6, padY: 4, gap: 10 } as const
export const PIN = { radius: 10, lift: 16 } as const
export const FINDING = { size: 9 } as const
/** A callout keeps this far (px) from every other junction it could hide. */
export const ANCHOR_CLEARANCE_PX = 5
/** Junctions closer than this on screen (px) are too crowded to label one by one: zoom in to read them. */
export const CROWD_PX = 20

export interface PlacedCallout {
  key: string
  ax: number
  ay: number
  box: Box
  lines: string[]
  tone: Tone
}
export interface PlacedPin {
  pin: ViewerPin
  x: number
  y: number
  cx: number
  cy: number
}
export interface PlacedFinding {
  finding: ViewerFinding
  x: number
  y: number
}

export const calloutSize = (lines: string[]): { w: number; h: number } => ({
  w: Math.ceil(Math.max(1, ...lines.map(l => l.length)) * CALLOUT.charPx + 2 * CALLOUT.padX),
  h: lines.length * CALLOUT.linePx + 2 * CALLOUT.padY,
})

export const overlaps = (a: Box, b: Box): boolean =>
  a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h

const inside = (b: Box, size: ViewportSize): boolean =>
  b.x >= 0 && b.y >= 0 && b.x + b.w <= size.width && b.y + b.h <= size.height

export function placePins(pins: ViewerPin[], view: View): PlacedPin[] {
  return pins.map(pin => {
    const s = worldToScreen(view, worldPoint(pin.x, pin.y))
    return { pin, x: s.x, y: s.y, cx: s.x, cy: s.y - PIN.lift }
  })
}

export function placeFindings(findings: ViewerFinding[], view: View): PlacedFinding[] {
  return findings.map(finding => {
    const s = worldToScreen(view, worldPoint(finding.x, finding.y))
    return { finding, x: s.x, y: s.y }
  })
}

/**
 * Places each callout beside its junction (right-above, right-below, left-above, left-below, first that fits),
 * skipping it when its junction has another within CROWD_PX, or when every spot would cover another callout, another junction, a pin or a finding, or leave the
 * viewport — so where junctions crowd (a nozzle array seen whole) the callouts give way to the geometry.
 * Labels are taken in the order given; `hidden` counts the ones on screen that found no room.
 */
export function layoutCallouts(
  labels: ViewerLabel[],
  view: View,
  size: ViewportSize,
  blocked: Box[] = [],
): { placed: PlacedCallout[]; hidden: number } {
  const cell = 64
  const grid = new Map<string, Array<{ box: Box; owner: number }>>()
  const cellsOf = (b: Box) => {
    const keys: string[] = []
    for (let i = Math.floor(b.x / cell); i <= Math.floor((b.x + b.w) / cell); i++) {
      for (let j = Math.floor(b.y / cell); j <= Math.floor((b.y + b.h) / cell); j++) keys.push(`${i},${j}`)
    }
    return keys
  }
  const free = (b: Box, self: number) =>
    cellsOf(b).every(k => !(grid.get(k) ?? []).some(o => o.owner !== self && overlaps(o.box, b)))
  const take = (box: Box, owner = -1) => {
    for (const k of cellsOf(box)) grid.set(k, [...(grid.get(k) ?? []), { box, owner }])
  }
  blocked.forEach(b => take(b))

  const r = ANCHOR_CLEARANCE_PX
  const anchors = labels.map(l => worldToScreen(view, worldPoint(l.x, l.y)))
  const onScreen = anchors.map(a => a.x >= 0 && a.y >= 0 && a.x <= size.width && a.y <= size.height)
  anchors.forEach((a, i) => {
    if (onScreen[i]) take({ x: a.x - r, y: a.y - r, w: 2 * r, h: 2 * r }, i)
  })
  const crowded = crowdedAnchors(anchors, onScreen)

  const placed: PlacedCallout[] = []
  let hidden = 0
  labels.forEach((l, i) => {
    const a = anchors[i]!
    if (!onScreen[i]) return
    if (crowded[i]) {
      hidden++
      return
    }
    const { w, h } = calloutSize(l.lines)
    const g = CALLOUT.gap
    const spots: Box[] = [
      { x: a.x + g, y: a.y - g - h, w, h },
      { x: a.x + g, y: a.y + g, w, h },
      { x: a.x - g - w, y: a.y - g - h, w, h },
      { x: a.x - g - w, y: a.y + g, w, h },
    ]
    const box = spots.find(b => inside(b, size) && free(b, i))
    if (!box) {
      hidden++
      return
    }
    take(box, i)
    placed.push({ key: l.elementId, ax: a.x, ay: a.y, box, lines: l.lines, tone: l.tone })
  })
  return { placed, hidden }
}

/** True for each anchor that has another within CROWD_PX: a callout there could not say which junction it means. */
function crowdedAnchors(anchors: Array<{ x: number; y: number }>, onScreen: boolean[]): boolean[] {
  const c = CROWD_PX
  const cells = new Map<string, number[]>()
  anchors.forEach((a, i) => {
    if (!onScreen[i]) return
    const k = `${Math.floor(a.x / c)},${Math.floor(a.y / c)}`
    cells.set(k, [...(cells.get(k) ?? []), i])
  })
  return anchors.map((a, i) => {
    if (!onScreen[i]) return false
    const cx = Math.floor(a.x / c)
    const cy = Math.floor(a.y / c)
    for (let dx = -1; dx <= 1; dx++)
      for (let dy = -1; dy <= 1; dy++) {
        for (const j of cells.get(`${cx + dx},${cy + dy}`) ?? []) {
          if (j !== i && Math.hypot(anchors[j]!.x - a.x, anchors[j]!.y - a.y) < c) return true
        }
      }
    return false
  })
}

export const pinBox = (p: PlacedPin): Box => ({
  x: p.cx - PIN.radius,
  y: p.cy - PIN.radius,
  w: 2 * PIN.radius,
  h: PIN.radius * 2 + PIN.lift,
})
export const findingBox = (f: PlacedFinding): Box => ({
  x: f.x - FINDING.size - 1,
  y: f.y - FINDING.size - 1,
  w: 2 * FINDING.size + 2,
  h: 2 * FINDING.size + 2,
})

/** The pin whose head is under the screen point (topmost = last drawn), or null. */
export function pinAt(pins: PlacedPin[], x: number, y: number): ViewerPin | null {
  for (let i = pins.length - 1; i >= 0; i--) {
    const p = pins[i]!
    if (Math.hypot(x - p.cx, y - p.cy) <= PIN.radius + 2) return p.pin
  }
  return null
}

export function findingAt(findings: PlacedFinding[], x: number, y: number): ViewerFinding | null {
  for (let i = findings.length - 1; i >= 0; i--) {
    const f = findings[i]!
    if (Math.abs(x - f.x) <= FINDING.size + 2 && Math.abs(y - f.y) <= FINDING.size + 2) return f.finding
  }
  return null
}
