// Security headers on every answer: pages (with a per-answer script nonce in the CSP), API successes and API errors.
import { describe, expect, inject, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'

const get = (path: string, init?: RequestInit) => fetch(inject('baseURL') + path, { redirect: 'manual', ...init })

/** The headers every answer carries, whatever it is. */
function expectCommon(h: Headers, what: string) {
  expect(h.get('x-content-type-options'), what).toBe('nosniff')
  expect(h.get('referrer-policy'), what).toBe('same-origin')
  expect(h.get('x-frame-options'), what).toBe('DENY')
  const pp = h.get('permissions-policy') ?? ''
  for (const feature of ['camera=()', 'microphone=()', 'geolocation=()', 'payment=()'])
    expect(pp, what).toContain(feature)
  expect(h.get('content-security-policy') ?? '', what).toMatch(/frame-ancestors 'none'/)
}

/** What an API answer carries besides: never stored, and a CSP that lets nothing run or load. */
function expectApi(h: Headers, what: string) {
  expectCommon(h, what)
  expect(h.get('cache-control'), what).toBe('no-store')
  expect(h.get('content-security-policy') ?? '', what).toMatch(/default-src 'none'/)
}

const directives = (csp: string) =>
  Object.fromEntries(
    csp
      .split(';')
      .map(d => d.trim())
      .filter(Boolean)
      .map(d => {
        const [name, ...sources] = d.split(/\s+/)
        return [name!, sources]
      }),
  )

describe('security headers', () => {
  it('a page: CSP with a fresh nonce on every script, no inline script without it, no framing', async () => {
    const res = await get('/sign-in', { headers: { accept: 'text/html' } })
    expect(res.status).toBe(200)
    expectCommon(res.headers, 'page')
    const csp = directives(res.headers.get('content-security-policy')!)
    expect(csp['default-src']).toEqual(["'self'"])
    expect(csp['object-src']).toEqual(["'none'"])
    expect(csp['base-uri']).toEqual(["'none'"])
    expect(csp['form-action']).toEqual(["'self'"])
    expect(csp['script-src-attr']).toEqual(["'none'"])
    expect(csp['script-src']).not.toContain("'unsafe-inline'")
    expect(csp['script-src']).not.toContain("'unsafe-eval'")
    const nonce = csp['script-src']!.find(s => s.startsWith("'nonce-"))!.slice(7, -1)
    expect(nonce.length).toBeGreaterThanOrEqual(16)
    const html = await res.text()
    const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map(m => m[0])
    expect(scripts.length).toBeGreaterThan(0)
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`)
    // A nonce is used once.
    const again = await get('/sign-in', { headers: { accept: 'text/html' } })
    expect(again.headers.get('content-security-policy')).not.toContain(nonce)
  })

  it('an API success: no-store and the API headers', async () => {
    const health = await get('/api/health')
    expect(health.status).toBe(200)
    expectApi(health.headers, 'GET /api/health')
    const api = await signedIn('designer@quillmere.example')
    const labs = await api.get('/api/labs')
    expect(labs.status).toBe(200)
    expectApi(labs.headers, 'GET /api/labs')
  })

  it('API errors (401, 404, 400, 403, 415): the same headers', async () => {
    const unauthorized = await get('/api/labs')
    expect(unauthorized.status).toBe(401)
    expectApi(unauthorized.headers, '401')
    const api = await signedIn('designer@quillmere.example')
    const notFound = await api.get('/api/labs/00000000-0000-4000-8000-000000000000/designs')
    expect(notFound.status).toBe(404)
    expectApi(notFound.headers, '404')
    const bad = await new ApiClient().request('POST', '/api/auth/login', '{"email":', {
      headers: { 'content-type': 'application/json' },
    })
    expect(bad.status).toBe(400)
    expectApi(bad.headers, '400')
    const foreign = await new ApiClient().request(
      'POST',
      '/api/auth/login',
      { email: 'a@b.example', password: 'x' },
      { headers: { origin: 'https://evil.example' } },
    )
    expect(foreign.status).toBe(403)
    expectApi(foreign.headers, '403')
    const form = await new ApiClient().request('POST', '/api/auth/login', 'email=a', {
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    })
    expect(form.status).toBe(415)
    expectApi(form.headers, '415')
  })

  it('a page that does not exist, and a static asset, carry them too', async () => {
    const missing = await get('/no-such-page', { headers: { accept: 'text/html' } })
    expect(missing.status).toBe(404)
    expectCommon(missing.headers, 'missing page')
    const icon = await get('/favicon.svg')
    expect(icon.status).toBe(200)
    expect(icon.headers.get('x-content-type-options')).toBe('nosniff')
  })
})
