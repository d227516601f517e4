// Junction kinds — declared once. The chip schema's components, the design list's filter (z.enum), the stored
// `junction_kinds`, the forecast's document kinds and every label on screen derive from this list.

export const JUNCTION_KINDS = ['t-junction', 'flow-focusing', 'step-nozzle', 'step-array', 'y-junction'] as const
export type JunctionKind = (typeof JUNCTION_KINDS)[number]

/** What each kind is called on screen (sentence case; `kindLabel(k, 'inline')` inside a sentence). */
export const JUNCTION_KIND_LABELS: Record<JunctionKind, string> = {
  't-junction': 'T-junction',
  'flow-focusing': 'Flow-focusing cross',
  'step-nozzle': 'Step nozzle',
  'step-array': 'Step nozzle array',
  'y-junction': 'Y-junction',
}

export const isJunctionKind = (kind: string): kind is JunctionKind =>
  (JUNCTION_KINDS as readonly string[]).includes(kind)

/** A kind's label; `inline` lower-cases it for the middle of a sentence (T- and Y-junction keep their capital). */
export function kindLabel(kind: string, style: 'start' | 'inline' = 'start'): string {
  const label = isJunctionKind(kind) ? JUNCTION_KIND_LABELS[kind] : kind
  return style === 'inline' && !/^[TY]-/.test(label) ? label.toLowerCase() : label
}
