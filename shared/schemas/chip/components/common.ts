import type { z } from 'zod'
import { safeText } from '../../text'
import { CHIP_LIMITS as L } from '../limits'
import { elementId, point } from '../primitives'
import { degrees } from '../units'

/** Fields every parametric component has: where it sits and how it is turned (degrees, counter-clockwise). */
export const componentBase = {
  id: elementId,
  name: safeText(undefined, 'Component name')
    .max(L.nameChars, { error: `Component name must be at most ${L.nameChars} characters` })
    .optional(),
  position: point,
  rotation: degrees('Component rotation').default(0),
  layerId: elementId,
}

/** Adds an issue on `field` when `ok` is false; used by the per-kind parameter checks. */
export function requireThat(ctx: z.core.$RefinementCtx, ok: boolean, field: string, message: string): void {
  if (!ok) ctx.addIssue({ code: 'custom', path: [field], message })
}
