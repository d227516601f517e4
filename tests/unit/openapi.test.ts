// The OpenAPI document is generated from the routes' own zod schemas and lists every route a token may call.
import { describe, expect, it } from 'vitest'
import { OPERATIONS, openApiDocument } from '../../server/utils/openapi'
import { apiRoutes } from '../support/routes'

const doc = openApiDocument('http://127.0.0.1:3000')
const asOpenApi = (template: string) => template.replace(/\[(\w+)\]/g, '{$1}')

describe('OpenAPI document (server/utils/openapi.ts)', () => {
  it('lists every route under server/api/v1 and server/api/labs, with its method', () => {
    const wanted = apiRoutes().filter(
      r => /^\/api\/(v1|labs)(\/|$)/.test(r.template) && r.template !== '/api/v1/openapi.json',
    )
    for (const r of wanted)
      expect(
        doc.paths[asOpenApi(r.template)]?.[r.method.toLowerCase()],
        `${r.method} ${r.template} is missing`,
      ).toBeDefined()
    expect(OPERATIONS).toHaveLength(wanted.length) // and nothing that does not exist
  })

  it('takes request bodies from the zod schemas the routes validate with (limits and enums included)', () => {
    const create = (doc.paths['/api/labs/{labId}/designs']!.post as any).requestBody.content['application/json'].schema
    expect(create.properties.name).toMatchObject({ type: 'string' })
    expect(create.required).toEqual(expect.arrayContaining(['name']))
    const verdict = (doc.paths['/api/labs/{labId}/revisions/{revisionId}/verdicts']!.post as any).requestBody.content[
      'application/json'
    ].schema
    expect(verdict.properties.verdict.enum).toEqual(['approve', 'request-changes'])
    const forecast = (doc.paths['/api/v1/forecast']!.post as any).requestBody.content['application/json'].schema
    expect(forecast.anyOf).toHaveLength(3)
    expect(JSON.stringify(forecast)).toContain('t-junction')
  })

  it('says who may call each lab route and that tokens are Bearer', () => {
    const op = doc.paths['/api/labs/{labId}/members/{userId}']!.patch as any
    expect(op['x-permission']).toBe('members:manage')
    expect(op.responses[403].description).toContain('members:manage')
    expect(op.parameters.map((p: { name: string }) => p.name)).toEqual(['labId', 'userId'])
    expect(doc.components.securitySchemes.bearer).toMatchObject({ type: 'http', scheme: 'bearer' })
    expect(() => JSON.stringify(doc)).not.toThrow()
  })
})
