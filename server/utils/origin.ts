import type { H3Event } from 'h3'
import { createError, getRequestHeader, getRequestURL } from 'h3'
import { useConfig } from './config'

/** DW_PUBLIC_URL without trailing slashes, or null when it is not set. */
const publicUrl = (): string | null => useConfig().publicUrl

/**
 * The address people open links in e-mail at, never taken from the request (a forged Host header must not put
 * someone else's address into an invitation): DW_PUBLIC_URL when set (always, behind a proxy; `npm start` and
 * `npm run dev` set it), else the address the server was told to listen on (HOST/PORT, localhost for all interfaces).
 */
export function appOrigin(_event?: H3Event): string {
  const configured = publicUrl()
  if (configured) return configured
  const { host, port } = useConfig().listen
  const name =
    !host || host === '0.0.0.0' || host === '::' || host === '[::]'
      ? 'localhost'
      : host.includes(':') && !host.startsWith('[')
        ? `[${host}]`
        : host
  return `http://${name}:${port}`
}

/**
 * The origin the app's own pages send requests from: DW_PUBLIC_URL's when set, else the request's own scheme and
 * host (a browser never lets a page forge the Host header of a request it sends).
 */
export function ownOrigin(event: H3Event): string {
  const configured = publicUrl()
  return configured ? new URL(configured).origin : getRequestURL(event).origin
}

const originOf = (value: string): string | null => {
  try {
    const origin = new URL(value).origin
    return origin === 'null' ? null : origin
  } catch {
    return null
  }
}

/**
 * CSRF defence for state-changing requests: 403 when the browser says the request comes from another site
 * (`Sec-Fetch-Site: cross-site`), or its Origin — or, without an Origin, its Referer — is not the app's own.
 * A request with neither header is not from a browser page (scripts, the command-line runners, curl) and passes:
 * the JSON-only rule for bodies keeps HTML forms from sending anything a route would take.
 */
export function assertSameOrigin(event: H3Event) {
  const own = ownOrigin(event)
  const origin = getRequestHeader(event, 'origin')
  const referer = getRequestHeader(event, 'referer')
  const from = origin !== undefined ? originOf(origin) : referer !== undefined ? originOf(referer) : undefined
  const crossSite = getRequestHeader(event, 'sec-fetch-site')?.toLowerCase() === 'cross-site'
  if (!crossSite && (from === undefined || from === own)) return
  const where = from ?? origin ?? referer ?? 'another site'
  throw createError({
    statusCode: 403,
    statusMessage: 'Forbidden',
    message: `This change was sent from another site (${where === 'null' ? 'a page without an address' : where}), so it was refused. To make it, use Dropwright itself at ${own}.`,
  })
}
