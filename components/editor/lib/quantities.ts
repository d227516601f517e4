// Forecast quantities (SI inside) shown in the trade's units through the one formatting module.
import type { Quantity } from '#shared/physics/quantity'
import { confidenceOf, formatSi } from '#shared/format/quantity'

/**
 * One forecast quantity as read on screen. `junctionValid` is whether the junction's size, rate and regime are all
 * inside their methods' validity: the revision page rounds by that, so the editor does too (same chip, same text).
 */
export function showQuantity(
  key: string,
  q: Quantity | { value: unknown; unit?: string; valid?: boolean },
  junctionValid = true,
): string {
  const v = q.value
  if (typeof v !== 'number') return String(v)
  if (key === 'regime') return String(v)
  return formatSi(v, q.unit ?? '1', confidenceOf((q.valid ?? true) && junctionValid))
}
