// The document request of POST /api/v1/forecast: { document, operatingPoint?, limits?, resistanceMethod? }.
// Kept here rather than in shared/schemas/forecast.ts so `operatingPoint` can default to the active one.
import { z } from 'zod'
import { parseChipDocument, type ChipDocument } from '../../schemas/chip'
import { quantityField } from '../../schemas/quantity'
import { ForecastInputError } from '../errors'
import { parseOrThrow } from '../forecast/issues'
import { documentPath } from './paths'
import type { DocumentForecastOptions } from './types'

export const documentForecastRequest = z.strictObject({
  document: z.unknown(),
  /** Operating point id; default the document's active one. */
  operatingPoint: z
    .string()
    .min(1, 'name an operating point id or leave "operatingPoint" out for the active one')
    .optional(),
  limits: z
    .strictObject({
      bondPressure: quantityField('pressure').optional(),
      pumpPressure: quantityField('pressure').optional(),
    })
    .optional(),
  resistanceMethod: z.enum(['series', 'approximate']).optional(),
})

export function parseDocumentRequest(input: unknown): {
  document: ChipDocument
  operatingPoint?: string
  options: DocumentForecastOptions
} {
  const request = parseOrThrow(documentForecastRequest, input)
  if (request.document === undefined)
    throw new ForecastInputError([
      { path: 'document', message: 'required field is missing: give the chip document (JSON) under "document"' },
    ])
  const parsed = parseChipDocument(request.document)
  if (!parsed.ok)
    throw new ForecastInputError(
      parsed.errors.map(error => ({ path: documentPath(error.path), message: error.message })),
    )
  const options: DocumentForecastOptions = {}
  if (request.limits) options.limits = request.limits
  if (request.resistanceMethod) options.resistanceMethod = request.resistanceMethod
  return request.operatingPoint === undefined
    ? { document: parsed.document, options }
    : { document: parsed.document, operatingPoint: request.operatingPoint, options }
}
