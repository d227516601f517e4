// Screen-space layout of what sits on top of the chip: junction callouts, review pins and rule findings. Pure:
// positions in CSS pixels from the view, callouts de-cluttered so none overlaps another or a marker.
import { worldPoint, worldToScreen, type View, type ViewportSize } from './viewport'

export type Tone = 'ok' | 'caution' | 'fault'
export type Severity = 'error' | 'warning' | 'info'

export interface ViewerLabel { elementId: string; x: number; y: number; lines: string[]; tone: Tone }
export interface ViewerPin { id: string; x: number; y: number; index: number; resolved: boolean; active?: boolean }
export interface ViewerFinding { id: string; severity: Severity; x: number; y: number; message: string }
export interface PinAddEvent { x: number; y: number; elementId?: string }

export interface Box { x: number; y: number; w: number; h: number }

/** Callout text metrics: JetBrains Mono advances 0.6 em per character. */
export const CALLOUT = { fontPx: 11, charPx: 6.6, linePx: 14, padX: 6, padY: 4, gap: 10 } as const
export const PIN = { radius: 10, lift: 16 } as const
export const FINDING = { size: 8 } as const

export interface PlacedCallout { key: string; ax: number; ay: number; box: Box; lines: string[]; tone: Tone }
export interface PlacedPin { pin: ViewerPin; x: number; y: number; cx: number; cy: number }
export interface PlacedFinding { finding: ViewerFinding; x: number; y: number }

export const calloutSize = (lines: string[]): { w: number; h: number } => ({
  w: Math.ceil(Math.max(1, ...lines.map((l) => l.length)) * CALLOUT.charPx + 2 * CALLOUT.padX),
  h: lines.length * CALLOUT.linePx + 2 * CALLOUT.padY,
})

export const overlaps = (a: Box, b: Box): boolean => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h

const inside = (b: Box, size: ViewportSize): boolean => b.x >= 0 && b.y >= 0 && b.x + b.w <= size.width && b.y + b.h <= size.height

export function placePins(pins: ViewerPin[], view: View): PlacedPin[] {
  return pins.map((pin) => {
    const s = worldToScreen(view, worldPoint(pin.x, pin.y))
    return { pin, x: s.x, y: s.y, cx: s.x, cy: s.y - PIN.lift }
  })
}

export function placeFindings(findings: ViewerFinding[], view: View): PlacedFinding[] {
  return findings.map((finding) => {
    const s = worldToScreen(view, worldPoint(finding.x, finding.y))
    return { finding, x: s.x, y: s.y }
  })
}

/**
 * Places each callout beside its junction (right-above, right-below, left-above, left-below, first that fits),
 * skipping it when every spot would cover another callout, a pin or a finding, or leave the viewport.
 * Labels are taken in the order given; `hidden` counts the ones on screen that found no room.
 */
export function layoutCallouts(labels: ViewerLabel[], view: View, size: ViewportSize, blocked: Box[] = []): { placed: PlacedCallout[]; hidden: number } {
  const cell = 64
  const grid = new Map<string, Box[]>()
  const cellsOf = (b: Box) => {
    const keys: string[] = []
    for (let i = Math.floor(b.x / cell); i <= Math.floor((b.x + b.w) / cell); i++) {
      for (let j = Math.floor(b.y / cell); j <= Math.floor((b.y + b.h) / cell); j++) keys.push(`${i},${j}`)
    }
    return keys
  }
  const free = (b: Box) => cellsOf(b).every((k) => !(grid.get(k) ?? []).some((o) => overlaps(o, b)))
  const take = (b: Box) => { for (const k of cellsOf(b)) grid.set(k, [...(grid.get(k) ?? []), b]) }
  blocked.forEach(take)

  const placed: PlacedCallout[] = []
  let hidden = 0
  for (const l of labels) {
    const a = worldToScreen(view, worldPoint(l.x, l.y))
    if (a.x < 0 || a.y < 0 || a.x > size.width || a.y > size.height) continue
    const { w, h } = calloutSize(l.lines)
    const g = CALLOUT.gap
    const spots: Box[] = [
      { x: a.x + g, y: a.y - g - h, w, h }, { x: a.x + g, y: a.y + g, w, h },
      { x: a.x - g - w, y: a.y - g - h, w, h }, { x: a.x - g - w, y: a.y + g, w, h },
    ]
    const box = spots.find((b) => inside(b, size) && free(b))
    if (!box) { hidden++; continue }
    take(box)
    placed.push({ key: l.elementId, ax: a.x, ay: a.y, box, lines: l.lines, tone: l.tone })
  }
  return { placed, hidden }
}

export const pinBox = (p: PlacedPin): Box => ({ x: p.cx - PIN.radius, y: p.cy - PIN.radius, w: 2 * PIN.radius, h: PIN.radius * 2 + PIN.lift })
export const findingBox = (f: PlacedFinding): Box => ({ x: f.x - FINDING.size - 1, y: f.y - FINDING.size - 1, w: 2 * FINDING.size + 2, h: 2 * FINDING.size + 2 })

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
