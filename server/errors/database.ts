// First of the server's error handlers: a database that cannot answer gives 503 with Retry-After (the JSON an API
// client can act on, or the app's own error page), never a 500. Other errors go on to Nuxt's handler.
import { defineNitroErrorHandler } from 'nitropack/runtime'
import { send, setResponseHeader, setResponseHeaders, setResponseStatus } from 'h3'
import { isDatabaseUnavailable, RETRY_AFTER_S } from '../utils/dbErrors'

const MESSAGE = `The database is not answering right now. Nothing was changed; try again in ${RETRY_AFTER_S} seconds.`

// One log line per RETRY_AFTER_S while the outage lasts, with how many answers it covers, not one per request.
let lastLog = 0
let quiet = 0

export default defineNitroErrorHandler((error, event) => {
  if (!isDatabaseUnavailable(error)) return
  if (Date.now() - lastLog > RETRY_AFTER_S * 1000) {
    console.error(
      `[db] unavailable (${(error.cause as Error | undefined)?.message ?? error.message}): answering 503${quiet ? `; ${quiet} more since the last line` : ''}`,
    )
    lastLog = Date.now()
    quiet = 0
  } else quiet++
  setResponseHeader(event, 'Retry-After', RETRY_AFTER_S)
  if (event.path.startsWith('/api/')) {
    setResponseStatus(event, 503, 'Service Unavailable')
    setResponseHeaders(event, { 'content-type': 'application/json', 'cache-control': 'no-store' })
    return send(
      event,
      JSON.stringify({
        statusCode: 503,
        statusMessage: 'Service Unavailable',
        message: MESSAGE,
        data: { retryAfterSeconds: RETRY_AFTER_S },
      }),
    )
  }
  Object.assign(error, { statusCode: 503, statusMessage: 'Service Unavailable', message: MESSAGE, unhandled: false })
})
