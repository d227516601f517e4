import type { ChipDocumentInput } from '#shared/schemas/chip'

type In = ChipDocumentInput

/** The elements one bank (ladder) contributes to a generated chip, and how its inlets are driven. */
export interface Elements {
  ports: NonNullable<In['ports']>
  components: NonNullable<In['components']>
  channels: NonNullable<In['channels']>
  inlets: NonNullable<In['operatingPoints']>[number]['inlets']
}

export interface Box {
  x0: number
  y0: number
  x1: number
  y1: number
}

/**
 * Box around a bank's ports (with their punches), channels (centre line ± half width) and component positions
 * (± `componentReach`, the farthest any component's parts reach from its position), µm.
 */
export function elementsBox(e: Elements, componentReach: number): Box {
  const b: Box = { x0: Infinity, y0: Infinity, x1: -Infinity, y1: -Infinity }
  const grow = (x: number, y: number, r: number) => {
    b.x0 = Math.min(b.x0, x - r)
    b.y0 = Math.min(b.y0, y - r)
    b.x1 = Math.max(b.x1, x + r)
    b.y1 = Math.max(b.y1, y + r)
  }
  for (const p of e.ports) grow(p.position.x, p.position.y, p.punchDiameter / 2)
  for (const c of e.channels) for (const p of c.points) grow(p.x, p.y, c.width / 2)
  for (const c of e.components) grow(c.position.x, c.position.y, componentReach)
  return b
}

/** The same elements moved by (dx, dy) µm. */
export function shiftElements(e: Elements, dx: number, dy: number): Elements {
  const m = <T extends { x: number; y: number }>(p: T): T => ({ ...p, x: p.x + dx, y: p.y + dy })
  return {
    ports: e.ports.map(p => ({ ...p, position: m(p.position) })),
    components: e.components.map(c => ({ ...c, position: m(c.position) })),
    channels: e.channels.map(c => ({ ...c, points: c.points.map(m) })),
    inlets: e.inlets,
  }
}

/**
 * The one operating point a generated chip starts with: water drops in the library's hydrofluoroether oil at 20 °C
 * (its properties and their sources live in shared/physics/liquids); the designer sets the real liquids in the editor.
 */
export function designPoint(inlets: Elements['inlets']): NonNullable<In['operatingPoints']>[number] {
  return {
    id: 'op-1',
    name: 'Design point',
    temperatureC: 20,
    continuousLiquid: { liquid: 'hydrofluoroether' },
    dispersedLiquid: { liquid: 'water' },
    inlets,
  }
}
