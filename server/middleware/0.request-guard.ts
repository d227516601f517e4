// First on every /api request, before the session is looked up: the API's security headers (kept even when an
// error handler writes its own defaults), then for state-changing requests the CSRF check (403, another site) and
// the body type (415, anything but JSON). The body itself is read, counted, after auth.ts (body.ts).
import type { ServerResponse } from 'node:http'
import { defineEventHandler } from 'h3'
import { isBearerWithoutCookies } from '../utils/bearer'
import { assertBodyType, WRITE_METHODS } from '../utils/bodyLimit'
import { assertSameOrigin } from '../utils/origin'
import { apiHeaders } from '../utils/securityHeaders'

export default defineEventHandler(event => {
  if (!event.path.startsWith('/api/')) return
  keepApiHeaders(event.node.res)
  if (!WRITE_METHODS.has(event.method)) return
  if (!isBearerWithoutCookies(event)) assertSameOrigin(event)
  assertBodyType(event)
})

/** Sets the API headers now and again as the head is written (Nitro's error handler sets its own on errors). */
function keepApiHeaders(res: ServerResponse) {
  const headers = apiHeaders()
  const writeHead = res.writeHead
  res.writeHead = function (this: ServerResponse, ...args: Parameters<ServerResponse['writeHead']>) {
    for (const [name, value] of Object.entries(headers)) this.setHeader(name, value)
    return writeHead.apply(this, args)
  } as ServerResponse['writeHead']
  for (const [name, value] of Object.entries(headers)) res.setHeader(name, value)
}
