import type { H3Event } from 'h3'
import { getRequestHeader } from 'h3'

declare module 'h3' {
  interface H3EventContext {
    viaToken?: boolean
  }
}

/** The token of an `Authorization: Bearer …` header (null without one). */
export function bearerToken(event: H3Event): string | null {
  const header = getRequestHeader(event, 'authorization')
  const m = header ? /^Bearer\s+(\S+)\s*$/i.exec(header) : null
  return m ? m[1]! : header && /^Bearer\b/i.test(header) ? '' : null
}

/**
 * A request that carries a Bearer token and no cookie at all: a script, not a browser page. Cross-site request
 * forgery rides on the cookies a browser adds by itself; a token has to be put in by the sender, so such a request
 * needs no Origin check.
 */
export function isBearerWithoutCookies(event: H3Event): boolean {
  return bearerToken(event) !== null && !getRequestHeader(event, 'cookie')
}
