// Every API route, read from server/api/** (Nitro's file names: `<name>.<method>.ts`, `index` for the folder
// itself), so tests that walk all routes also walk a route added tomorrow.
import { readdirSync } from 'node:fs'
import { join, relative } from 'node:path'

export interface ApiRoute {
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE'
  template: string
  file: string
}

const apiDir = new URL('../../server/api', import.meta.url).pathname

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap(e =>
    e.isDirectory() ? files(join(dir, e.name)) : [join(dir, e.name)],
  )
}

export function apiRoutes(): ApiRoute[] {
  return files(apiDir)
    .filter(f => f.endsWith('.ts'))
    .map(file => {
      const rel = relative(apiDir, file).replace(/\.ts$/, '')
      const m = /^(.*?)(?:\.(get|post|patch|put|delete))?$/.exec(rel)!
      const path = m[1]!.replace(/(^|\/)index$/, '')
      return {
        method: (m[2] ?? 'get').toUpperCase() as ApiRoute['method'],
        template: `/api${path ? `/${path}` : ''}`,
        file: rel,
      }
    })
    .sort((a, b) => a.template.localeCompare(b.template) || a.method.localeCompare(b.method))
}

/** Fills `[param]` segments; a param the map lacks throws, so a new route's parameter is never silently skipped. */
export function fill(template: string, params: Record<string, string>): string {
  return template.replace(/\[(\w+)\]/g, (_, name: string) => {
    const value = params[name]
    if (value === undefined) throw new Error(`no value for route parameter [${name}] in ${template}`)
    return encodeURIComponent(value)
  })
}

export const isWrite = (r: ApiRoute) => r.method !== 'GET'
