// Request bodies, counted on the stream whatever the transfer encoding (Content-Length or chunked): what each route
// accepts (docs/api-limits.md) and the one reader every route uses. A body over its limit answers 413 the moment the
// limit is passed; the server never holds more than the limit of one body in memory.
import { createWriteStream } from 'node:fs'
import { writeFile } from 'node:fs/promises'
import type { H3Event } from 'h3'
import { createError, getRequestHeader } from 'h3'

const KiB = 1024
const MiB = 1024 * KiB

/** Bodies that carry a chip document (a design, a revision, a forecast request): 8 MiB. */
export const MAX_DOCUMENT_BYTES = 8 * MiB
/** Every other body (sign-in, invitations, comments, verdicts, …): 64 KiB, far above the longest field allowed. */
export const MAX_SMALL_BYTES = 64 * KiB

/** The only body type the API takes today. A route that documents another lists it in ROUTE_BODIES. */
export const JSON_TYPE = 'application/json'
/** Micrograph uploads (multipart/form-data with one PNG, JPEG or TIFF): 25 MiB, a 20 MB camera image and its form. */
export const MAX_UPLOAD_BYTES = 25 * MiB

interface BodyRule {
  method: string
  pattern: RegExp
  limit: number
  types?: string[]
  /** The route streams the body to a file itself (saveLimitedBody) instead of having it read into memory first. */
  toFile?: true
}

/** Routes whose limit or accepted types differ from the default (64 KiB of JSON). */
export const ROUTE_BODIES: BodyRule[] = [
  { method: 'POST', pattern: /^\/api\/labs\/[^/]+\/designs$/, limit: MAX_DOCUMENT_BYTES },
  { method: 'POST', pattern: /^\/api\/labs\/[^/]+\/designs\/[^/]+\/revisions$/, limit: MAX_DOCUMENT_BYTES },
  { method: 'POST', pattern: /^\/api\/v1\/forecast$/, limit: MAX_DOCUMENT_BYTES },
  // The planner takes a forecast request (a chip document) plus its target.
  { method: 'POST', pattern: /^\/api\/v1\/plan$/, limit: MAX_DOCUMENT_BYTES },
  // Bench results (issue 13): runs as JSON or a CSV of sizes (up to 4 MB of text); micrographs as a multipart upload.
  {
    method: 'POST',
    pattern: /^\/api\/labs\/[^/]+\/revisions\/[^/]+\/bench-runs$/,
    limit: MAX_DOCUMENT_BYTES,
    types: [JSON_TYPE, 'text/csv'],
  },
  {
    method: 'POST',
    pattern: /^\/api\/labs\/[^/]+\/bench-runs\/[^/]+\/micrographs$/,
    limit: MAX_UPLOAD_BYTES,
    types: ['multipart/form-data'],
    toFile: true,
  },
  // As-built reports (issue 15): a profilometer CSV or a photo per upload, up to the micrograph limit.
  {
    method: 'POST',
    pattern: /^\/api\/labs\/[^/]+\/revisions\/[^/]+\/as-built\/[^/]+\/files$/,
    limit: MAX_UPLOAD_BYTES,
    types: ['multipart/form-data'],
  },
]

export const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

export function bodyRule(method: string, path: string): { limit: number; types: string[]; toFile: boolean } {
  const rule = ROUTE_BODIES.find(r => r.method === method && r.pattern.test(path))
  return { limit: rule?.limit ?? MAX_SMALL_BYTES, types: rule?.types ?? [JSON_TYPE], toFile: rule?.toFile ?? false }
}

const size = (bytes: number) => (bytes >= MiB ? `${+(bytes / MiB).toFixed(1)} MiB` : `${+(bytes / KiB).toFixed(1)} KiB`)

/** Does the request say it has a body (a Content-Length above 0, or chunks)? */
export function hasBody(event: H3Event): boolean {
  const length = Number.parseInt(getRequestHeader(event, 'content-length') ?? '', 10)
  return (Number.isFinite(length) && length > 0) || getRequestHeader(event, 'transfer-encoding') !== undefined
}

/**
 * 415 unless the body is of a type the route accepts. Parameters are allowed when they are a UTF-8 charset.
 * A write without a body and without a Content-Type (sign-out, delete) passes; a form type never does.
 */
export function assertBodyType(
  event: H3Event,
  types: string[] = bodyRule(event.method, event.path.split('?')[0]!).types,
) {
  const header = getRequestHeader(event, 'content-type')
  if (header === undefined && !hasBody(event)) return
  const [type = '', ...params] = (header ?? '').split(';').map(p => p.trim().toLowerCase())
  const charsetOk = params.every(
    p => p === '' || /^charset="?utf-8"?$/.test(p) || (type === 'multipart/form-data' && /^boundary=/.test(p)),
  )
  if (types.includes(type) && charsetOk) return
  const accepted = types.join(' or ')
  throw createError({
    statusCode: 415,
    statusMessage: 'Unsupported Media Type',
    message: header
      ? `This address accepts ${accepted} bodies (UTF-8) only; the request sent ${header.split(';')[0]!.trim() || 'an empty type'}${charsetOk ? '' : ` with ${params.filter(Boolean).join('; ')}`}`
      : `This address accepts ${accepted} bodies only; the request sent a body without a Content-Type`,
    data: { accepted: types },
  })
}

const tooLarge = (limit: number, seen: string) =>
  createError({
    statusCode: 413,
    statusMessage: 'Payload Too Large',
    message: `The request body is ${seen}; this address accepts at most ${size(limit)}`,
    data: { limitBytes: limit },
  })

declare module 'h3' {
  interface H3EventContext {
    countedBody?: Promise<Buffer | undefined>
  }
}

/**
 * After a refusal the client may still be sending: once the 413 is out, read and drop what keeps coming for at most
 * two seconds (so the client reads the answer instead of a reset connection), then close the connection.
 */
function discardRest(event: H3Event) {
  const { req, res } = event.node
  const drop = () => {
    req.removeAllListeners('data')
    req.on('data', () => {})
    req.resume()
    if (req.readableEnded) return
    const timer = setTimeout(() => req.socket?.destroy(), 2000)
    timer.unref()
    req.once('end', () => clearTimeout(timer))
    req.once('close', () => clearTimeout(timer))
  }
  if (res.writableFinished) drop()
  else res.once('finish', drop)
}

/**
 * The request body, read once per request with a byte counter (the same promise on every later call): undefined
 * without a body, else the bytes. 413 as soon as the count passes `limit`; reading stops there.
 */
export function readLimitedBody(
  event: H3Event,
  limit = bodyRule(event.method, event.path.split('?')[0]!).limit,
): Promise<Buffer | undefined> {
  if (event.context.countedBody) return event.context.countedBody
  const promise = readCounted(event, limit).then(body => {
    // h3's own readers (readBody, readRawBody) take this body instead of reading the stream a second time.
    if (body) (event.node.req as unknown as Record<symbol, unknown>)[Symbol.for('h3RawBody')] = body
    return body
  })
  event.context.countedBody = promise
  return promise
}

function readCounted(event: H3Event, limit: number): Promise<Buffer | undefined> {
  if (!hasBody(event)) return Promise.resolve(undefined)
  const chunks: Buffer[] = []
  return countBody(event, limit, {
    write: chunk => void chunks.push(chunk),
    end: count => Promise.resolve(Buffer.concat(chunks, count)),
    abort: () => void (chunks.length = 0),
  })
}

/**
 * The request body streamed into `file` with the same byte counter (413 the moment the limit passes, the file then
 * removed by the caller's clean-up): for large uploads, which then never sit whole in the server's memory. Answers
 * the byte count (0, and an empty file, without a body).
 */
export function saveLimitedBody(
  event: H3Event,
  file: string,
  limit = bodyRule(event.method, event.path.split('?')[0]!).limit,
): Promise<number> {
  if (!hasBody(event)) return writeFile(file, '').then(() => 0)
  const out = createWriteStream(file)
  const { req } = event.node
  // A file that cannot be written (disk full) lets the rest of the body flow past and answers 503 at its end.
  let failed: Error | undefined
  out.on('error', error => {
    failed ??= error
    req.resume()
  })
  return countBody(event, limit, {
    write: chunk => {
      if (failed || out.write(chunk)) return
      req.pause()
      out.once('drain', () => req.resume())
    },
    end: count =>
      new Promise((resolve, reject) => {
        const refuse = () =>
          reject(
            createError({
              statusCode: 503,
              statusMessage: 'Service Unavailable',
              message: `The upload could not be kept on the server right now (${failed!.message.slice(0, 80)}); send it again in a minute`,
            }),
          )
        if (failed) return refuse()
        out.end(() => (failed ? refuse() : resolve(count)))
      }),
    abort: () => void out.destroy(),
  })
}

interface BodySink<T> {
  write: (chunk: Buffer) => void
  end: (count: number) => Promise<T>
  abort: () => void
}

function countBody<T>(event: H3Event, limit: number, sink: BodySink<T>): Promise<T> {
  const declared = Number.parseInt(getRequestHeader(event, 'content-length') ?? '', 10)
  if (Number.isFinite(declared) && declared > limit) {
    sink.abort()
    discardRest(event)
    return Promise.reject(tooLarge(limit, size(declared)))
  }
  const { req } = event.node
  return new Promise((resolve, reject) => {
    let count = 0
    const onData = (chunk: Buffer) => {
      count += chunk.length
      if (count > limit) {
        cleanup()
        req.pause()
        sink.abort()
        discardRest(event)
        reject(tooLarge(limit, `over ${size(limit)}`))
        return
      }
      sink.write(chunk)
    }
    const onEnd = () => {
      cleanup()
      sink.end(count).then(resolve, reject)
    }
    const onError = (error: Error) => {
      cleanup()
      sink.abort()
      reject(
        createError({
          statusCode: 400,
          statusMessage: 'Bad Request',
          message: `The request body could not be read: ${error.message}`,
        }),
      )
    }
    const onClose = () => {
      if (!req.readableEnded) onError(new Error('the connection closed before the body ended'))
    }
    const cleanup = () => {
      req.off('data', onData)
      req.off('end', onEnd)
      req.off('error', onError)
      req.off('close', onClose)
    }
    req.on('data', onData)
    req.on('end', onEnd)
    req.on('error', onError)
    req.on('close', onClose)
  })
}
