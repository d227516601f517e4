// Which numbers the inspector shows for each kind of element, with their units, and the schema check of one
// edited field (the same zod schema the document uses, so the form and the document never disagree).
import type { z } from 'zod'
import { channel, component, mark, port } from '#shared/schemas/chip'
import { setPath } from '#shared/editor/fields'
import type { ElementCollection } from '#shared/editor'

export interface FieldSpec {
  path: string
  label: string
  unit: 'µm' | '°' | ''
  step?: number
}

const pos: FieldSpec[] = [
  { path: 'position.x', label: 'x', unit: 'µm' },
  { path: 'position.y', label: 'y', unit: 'µm' },
]
const placed: FieldSpec[] = [...pos, { path: 'rotation', label: 'Rotation', unit: '°' }]

export const FIELDS: Record<string, FieldSpec[]> = {
  't-junction': [
    ...placed,
    { path: 'mainWidth', label: 'Main channel width', unit: 'µm' },
    { path: 'inletWidth', label: 'Side inlet width', unit: 'µm' },
    { path: 'armLength', label: 'Arm length', unit: 'µm' },
  ],
  'flow-focusing': [
    ...placed,
    { path: 'orificeWidth', label: 'Orifice width', unit: 'µm' },
    { path: 'orificeLength', label: 'Orifice length', unit: 'µm' },
    { path: 'continuousWidth', label: 'Continuous arm width', unit: 'µm' },
    { path: 'dispersedWidth', label: 'Dispersed inlet width', unit: 'µm' },
    { path: 'outletWidth', label: 'Outlet width', unit: 'µm' },
    { path: 'armLength', label: 'Arm length', unit: 'µm' },
  ],
  'y-junction': [
    ...placed,
    { path: 'angle', label: 'Angle between arms', unit: '°' },
    { path: 'continuousWidth', label: 'Continuous arm width', unit: 'µm' },
    { path: 'dispersedWidth', label: 'Dispersed arm width', unit: 'µm' },
    { path: 'outletWidth', label: 'Outlet width', unit: 'µm' },
    { path: 'armLength', label: 'Arm length', unit: 'µm' },
  ],
  'step-nozzle': [
    ...placed,
    { path: 'nozzleWidth', label: 'Nozzle width', unit: 'µm' },
    { path: 'nozzleLength', label: 'Nozzle length', unit: 'µm' },
    { path: 'reservoirWidth', label: 'Reservoir width', unit: 'µm' },
    { path: 'reservoirLength', label: 'Reservoir length', unit: 'µm' },
  ],
  'step-array': [
    ...placed,
    { path: 'nozzleCount', label: 'Nozzles', unit: '', step: 1 },
    { path: 'pitch', label: 'Pitch', unit: 'µm' },
    { path: 'nozzleWidth', label: 'Nozzle width', unit: 'µm' },
    { path: 'nozzleLength', label: 'Nozzle length', unit: 'µm' },
    { path: 'supplyWidth', label: 'Supply width', unit: 'µm' },
    { path: 'reservoirWidth', label: 'Reservoir width', unit: 'µm' },
    { path: 'margin', label: 'End margin', unit: 'µm' },
  ],
  serpentine: [
    ...placed,
    { path: 'turns', label: 'Turns', unit: '', step: 1 },
    { path: 'pitch', label: 'Pitch', unit: 'µm' },
    { path: 'width', label: 'Width', unit: 'µm' },
    { path: 'totalLength', label: 'Total length', unit: 'µm' },
  ],
  port: [...pos, { path: 'punchDiameter', label: 'Punch diameter', unit: 'µm' }],
  channel: [{ path: 'width', label: 'Width', unit: 'µm' }],
  cross: [...pos, { path: 'size', label: 'Size', unit: 'µm' }, { path: 'lineWidth', label: 'Line width', unit: 'µm' }],
  text: [...pos, { path: 'height', label: 'Text height', unit: 'µm' }],
}

export const kindOf = (collection: ElementCollection, el: { kind?: string }): string =>
  collection === 'components' || collection === 'marks' ? el.kind! : collection === 'ports' ? 'port' : 'channel'

export function readPath(el: unknown, path: string): unknown {
  return path
    .split('.')
    .reduce<unknown>((v, k) => (v && typeof v === 'object' ? (v as Record<string, unknown>)[k] : undefined), el)
}

const SCHEMA = { components: component, ports: port, channels: channel, marks: mark }

/** A schema's message for `el` with one field changed (the issue at that field first), or null when it is valid. */
export function fieldError(schema: z.ZodType, el: object, path: string, value: unknown): string | null {
  const r = schema.safeParse(setPath(el, path, value))
  if (r.success) return null
  return (r.error.issues.find(i => i.path.join('.') === path) ?? r.error.issues[0]!).message
}

/** The chip schema's message for this element with one number changed, or null when it is valid. */
export function checkField(collection: ElementCollection, el: object, path: string, value: unknown): string | null {
  if (typeof value !== 'number' || !Number.isFinite(value)) return 'Enter a number'
  return fieldError(SCHEMA[collection], el, path, value)
}

/** What a person typed into a number box: a decimal (comma or point, optional exponent), else NaN ("", "abc", "0x10"). */
export function typedNumber(text: string): number {
  const t = text.trim().replace(',', '.')
  return /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t) ? Number(t) : Number.NaN
}
