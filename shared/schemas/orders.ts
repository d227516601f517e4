// Payloads of fabrication orders: the order a release creates, status moves, messages.
import { z } from 'zod'
import { MASK_MEDIA, MASK_POLARITIES, ORDER_STATUSES, SUBSTRATES } from '../fabrication/orderStatus'
import { labParams } from './labs'
import { safeText } from './text'

export const orderParams = labParams.extend({ orderId: z.uuid('Order id must be a UUID') })

const isoDate = /^\d{4}-\d{2}-\d{2}$/
/** What the fabrication partner needs to make the chips. Every field has a default so a release is one click. */
export const orderDetails = z.object({
  quantity: z
    .number({ error: 'Quantity must be a number of chips' })
    .int('Quantity must be a whole number of chips')
    .min(1, 'Order at least 1 chip')
    .max(500, 'An order is at most 500 chips: split larger runs')
    .default(1),
  substrate: z
    .enum(SUBSTRATES, { error: `Substrate must be one of: ${SUBSTRATES.join(', ')}` })
    .default('pdms-on-glass'),
  maskPolarity: z.enum(MASK_POLARITIES, { error: 'Mask polarity must be positive or negative' }).default('positive'),
  maskMedium: z.enum(MASK_MEDIA, { error: 'Mask must be film or chrome' }).default('film'),
  dueDate: safeText(undefined, 'Due date')
    .regex(isoDate, 'Due date must be a date like 2027-01-31')
    .refine(d => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)), 'Due date must be a real calendar date')
    .nullable()
    .default(null),
  poNumber: safeText(undefined, 'Purchase-order number')
    .trim()
    .max(60, 'A purchase-order number is at most 60 characters')
    .default(''),
  notes: safeText(undefined, 'Notes').max(4000, 'Order notes are at most 4000 characters').default(''),
})
export type OrderDetails = z.infer<typeof orderDetails>

const note = safeText(undefined, 'Note').max(2000, 'A note is at most 2000 characters').default('')
export const releaseBody = z.object({ note, order: orderDetails.default(() => orderDetails.parse({})) })
export type ReleaseBody = z.input<typeof releaseBody>

export const orderMove = z
  .object({
    status: z.enum(ORDER_STATUSES, { error: `Status must be one of: ${ORDER_STATUSES.join(', ')}` }),
    note,
    trackingNumber: safeText(undefined, 'Tracking number')
      .trim()
      .max(80, 'A tracking number is at most 80 characters')
      .optional(),
  })
  .superRefine((m, ctx) => {
    if (m.status === 'shipped' && !m.trackingNumber)
      ctx.addIssue({ code: 'custom', path: ['trackingNumber'], message: 'Give the tracking number of the shipment' })
    if (m.status === 'on-hold' && !m.note.trim())
      ctx.addIssue({ code: 'custom', path: ['note'], message: 'Say why the order is on hold' })
  })
export type OrderMove = z.input<typeof orderMove>

export const orderMessage = z.object({
  body: safeText(undefined, 'Message')
    .trim()
    .min(1, 'Write a message')
    .max(5000, 'A message is at most 5000 characters'),
})
