// A micrograph upload's multipart/form-data body (read once, counted against the route's limit by the body
// middleware): one file part "image" and text fields for the scale.
import type { H3Event } from 'h3'
import { createError, readMultipartFormData } from 'h3'
import { readLimitedBody } from './bodyLimit'

export async function readMicrographForm(event: H3Event): Promise<{ file: { bytes: Uint8Array, fileName: string }, fields: Record<string, string> }> {
  await readLimitedBody(event)
  const parts = await readMultipartFormData(event)
  const bad = (message: string) => createError({ statusCode: 400, statusMessage: 'Bad Request', message })
  if (!parts?.length) throw bad('Send the micrograph as multipart/form-data with a file field "image" and the scale ("umPerPx", or "barPx" and "barUm")')
  const fields: Record<string, string> = {}
  let file: { bytes: Uint8Array, fileName: string } | undefined
  for (const part of parts) {
    if (part.name === 'image' && part.filename !== undefined) file = { bytes: new Uint8Array(part.data), fileName: part.filename || 'micrograph' }
    else if (part.name && part.filename === undefined && part.data.length <= 200) fields[part.name] = part.data.toString('utf8')
  }
  if (!file || file.bytes.byteLength === 0) throw bad('The form has no file in its "image" field: choose a PNG, JPEG or TIFF micrograph')
  return { file, fields }
}

/** One file part named `field` (an as-built report's profilometer CSV or photo). */
export async function readFileForm(event: H3Event, field: string, hint: string): Promise<{ bytes: Uint8Array, fileName: string }> {
  await readLimitedBody(event)
  const parts = await readMultipartFormData(event)
  const part = parts?.find(p => p.name === field && p.filename !== undefined)
  if (!part || part.data.length === 0) throw createError({ statusCode: 400, statusMessage: 'Bad Request', message: hint })
  return { bytes: new Uint8Array(part.data), fileName: part.filename || field }
}
