// Multipart/form-data bodies, parsed by busboy (streaming, with a Boyer–Moore–Horspool boundary search) in 1 MiB
// slices that yield to the event loop between them (h3's own parser took 1–2 s of the main thread on a 20 MB file).
// An as-built file is read once by the body middleware, counted against the route's limit; a micrograph upload is
// streamed into a temporary file instead (withUploadFile) and parsed there by the imaging process.
import { mkdtemp, rm } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import Busboy from 'busboy'
import type { H3Event } from 'h3'
import { createError, getRequestHeader } from 'h3'
import { readLimitedBody, saveLimitedBody } from './bodyLimit'

export interface FormPart {
  name: string
  filename?: string
  data: Buffer
}

/** How much of the body busboy is given before the event loop gets a turn. */
const SLICE = 1024 * 1024
/** Text fields longer than this are not scale numbers or notes: they are cut (and then refused by their schema). */
const FIELD_MAX = 64 * 1024

const bad = (message: string) => createError({ statusCode: 400, statusMessage: 'Bad Request', message })

/** Every part of a multipart body: files with their name, text fields as bytes. */
export function parseMultipart(body: Buffer, contentType: string): Promise<FormPart[]> {
  return new Promise((resolve, reject) => {
    let parser: Busboy.Busboy
    try {
      parser = Busboy({
        headers: { 'content-type': contentType },
        limits: { fieldSize: FIELD_MAX, files: 8, fields: 32 },
      })
    } catch {
      reject(bad('The body is not multipart/form-data with a boundary: send it as a form (FormData)'))
      return
    }
    const parts: FormPart[] = []
    parser.on('file', (name, stream, info) => {
      const chunks: Buffer[] = []
      stream.on('data', (chunk: Buffer) => chunks.push(chunk))
      // A cut-off body errors the file's stream too; the parser's own error (below) answers for both.
      stream.on('error', () => {})
      stream.on('end', () => parts.push({ name, filename: info.filename ?? '', data: Buffer.concat(chunks) }))
    })
    parser.on('field', (name, value) => parts.push({ name, data: Buffer.from(value, 'utf8') }))
    parser.on('error', () =>
      reject(bad('The multipart body is malformed (a part or the closing boundary is missing): send the form again')),
    )
    parser.on('close', () => resolve(parts))
    let offset = 0
    const feed = () => {
      if (offset >= body.length) return void parser.end()
      const end = Math.min(body.length, offset + SLICE)
      parser.write(body.subarray(offset, end))
      offset = end
      setImmediate(feed)
    }
    feed()
  })
}

async function readParts(event: H3Event): Promise<FormPart[]> {
  const body = await readLimitedBody(event)
  if (!body?.length) return []
  return parseMultipart(body, getRequestHeader(event, 'content-type') ?? '')
}

/**
 * The upload's body streamed into a file of its own (counted against the route's limit), for as long as `use` runs;
 * the imaging process reads and parses it there, so the request thread never holds the bytes.
 */
export async function withUploadFile<T>(
  event: H3Event,
  use: (upload: { bodyFile: string; contentType: string }) => Promise<T>,
): Promise<T> {
  const dir = await mkdtemp(join(tmpdir(), 'dropwright-upload-'))
  try {
    const bodyFile = join(dir, 'body')
    await saveLimitedBody(event, bodyFile)
    return await use({ bodyFile, contentType: getRequestHeader(event, 'content-type') ?? '' })
  } finally {
    await rm(dir, { recursive: true, force: true })
  }
}

/** A micrograph form's file (field "image") and its short text fields (the scale). */
export function micrographForm(parts: FormPart[]): {
  file: { bytes: Uint8Array; fileName: string }
  fields: Record<string, string>
} {
  if (!parts.length)
    throw bad(
      'Send the micrograph as multipart/form-data with a file field "image" and the scale ("umPerPx", or "barPx" and "barUm")',
    )
  const fields: Record<string, string> = {}
  let file: { bytes: Uint8Array; fileName: string } | undefined
  for (const part of parts) {
    if (part.name === 'image' && part.filename !== undefined)
      file = { bytes: part.data, fileName: part.filename || 'micrograph' }
    else if (part.name && part.filename === undefined && part.data.length <= 200)
      fields[part.name] = part.data.toString('utf8')
  }
  if (!file || file.bytes.byteLength === 0)
    throw bad('The form has no file in its "image" field: choose a PNG, JPEG or TIFF micrograph')
  return { file, fields }
}

/** One file part named `field` (an as-built report's profilometer CSV or photo). */
export async function readFileForm(
  event: H3Event,
  field: string,
  hint: string,
): Promise<{ bytes: Uint8Array; fileName: string }> {
  const parts = await readParts(event)
  const part = parts.find(p => p.name === field && p.filename !== undefined)
  if (!part || part.data.length === 0) throw bad(hint)
  return { bytes: new Uint8Array(part.data), fileName: part.filename || field }
}
