// The address a request comes from, for per-address limits. X-Forwarded-For is believed only when the socket's peer
// is a proxy named in DW_TRUSTED_PROXIES (addresses or CIDRs, comma- or space-separated; also `loopback`,
// `linklocal`, `uniquelocal`). By default nobody is trusted and the socket's address is used, so a client cannot
// choose the address it is counted under. The walk through the header (right to left, stopping at the first
// address that is not a trusted proxy) is proxy-addr's, the one Express uses.
import type { H3Event } from 'h3'
import proxyAddr from 'proxy-addr'
import { useConfig } from './config'

let trust: ((addr: string, i: number) => boolean) | undefined
let trustFrom: string | undefined

function trusted(): (addr: string, i: number) => boolean {
  const configured = useConfig().trustedProxies
  if (!trust || trustFrom !== configured) {
    const list = configured.split(/[\s,]+/).filter(Boolean)
    try {
      trust = proxyAddr.compile(list)
    } catch (error) {
      throw new Error(
        `DW_TRUSTED_PROXIES must list IP addresses or CIDR ranges (got "${configured}"): ${(error as Error).message}`,
      )
    }
    trustFrom = configured
  }
  return trust
}

/** The client's address: the socket's, or the one a trusted proxy forwarded. IPv4-mapped IPv6 shown as IPv4. */
export function clientAddress(event: H3Event): string {
  const req = event.node.req
  if (!req.socket?.remoteAddress) return 'unknown'
  const address = proxyAddr(req, trusted())
  return address.replace(/^::ffff:(\d+\.\d+\.\d+\.\d+)$/, '$1').slice(0, 64)
}
