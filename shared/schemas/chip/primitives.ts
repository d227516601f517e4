import { z } from 'zod'
import { safeText } from '../text'
import { coordinateUm } from './units'

/** A point in document (world) coordinates: µm, x to the right, y up (the mask's own frame). */
export const point = z.object({ x: coordinateUm('x'), y: coordinateUm('y') })
export type Point = z.infer<typeof point>

/** Element ids are short, stable and safe in file names and DXF handles. */
export const elementId = safeText({ error: 'Id must be a string' }, 'Id')
  .min(1, { error: 'Id must not be empty' })
  .max(64, { error: 'Id must be at most 64 characters' })
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, {
    error: 'Id may only use letters, digits, ".", "_" and "-", starting with a letter or digit',
  })

/** A channel end attached to a named terminal of a port or a component. */
export const terminalRef = z.object({
  element: elementId,
  terminal: safeText({ error: 'Terminal name must be a string' }, 'Terminal name')
    .min(1, { error: 'Terminal name must not be empty' })
    .max(64, { error: 'Terminal name must be at most 64 characters' }),
})
export type TerminalRef = z.infer<typeof terminalRef>
