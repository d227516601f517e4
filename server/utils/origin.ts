import type { H3Event } from 'h3'
import { getRequestURL } from 'h3'

/**
 * The address people open links in e-mail at. DW_PUBLIC_URL in production (behind a proxy, and so that a forged
 * Host header can never put someone else's address into an invitation); the request's own origin otherwise.
 */
export function appOrigin(event: H3Event): string {
  const configured = process.env.DW_PUBLIC_URL?.replace(/\/+$/, '')
  return configured || getRequestURL(event).origin
}
