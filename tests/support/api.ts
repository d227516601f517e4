// A small HTTP client for API tests: keeps the session cookie like a browser would.
import { inject } from 'vitest'
import { DEMO_PASSWORD } from '../../server/db/demo'

export class ApiClient {
  cookies = new Map<string, string>()
  constructor(readonly baseURL = inject('baseURL')) {}

  async request(method: string, path: string, body?: unknown, init: RequestInit = {}) {
    const headers = new Headers(init.headers)
    if (body !== undefined && !headers.has('content-type')) headers.set('content-type', 'application/json')
    if (this.cookies.size) headers.set('cookie', [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '))
    const res = await fetch(this.baseURL + path, {
      ...init,
      method,
      headers,
      redirect: 'manual',
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
    })
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';')
      const [name, value] = pair!.split('=')
      if (/Max-Age=0|Expires=Thu, 01 Jan 1970/i.test(line) || value === '') this.cookies.delete(name!)
      else this.cookies.set(name!, value!)
    }
    const text = await res.text()
    let json: any = null
    try {
      json = text ? JSON.parse(text) : null
    } catch {
      json = text
    }
    return { status: res.status, headers: res.headers, json }
  }

  get = (path: string) => this.request('GET', path)
  post = (path: string, body?: unknown) => this.request('POST', path, body)
  patch = (path: string, body?: unknown) => this.request('PATCH', path, body)
  delete = (path: string) => this.request('DELETE', path)

  async signIn(email: string, password = DEMO_PASSWORD) {
    const res = await this.post('/api/auth/login', { email, password })
    if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.json)}`)
    return this
  }

  async labId(slug: string): Promise<string> {
    const res = await this.get('/api/labs')
    const lab = (res.json as Array<{ slug: string; labId: string }>).find(l => l.slug === slug)
    if (!lab) throw new Error(`not a member of ${slug}`)
    return lab.labId
  }
}

export const signedIn = (email: string) => new ApiClient().signIn(email)
