import { defineStore } from 'pinia'

export interface ReferenceOperation {
  method: string
  path: string
  summary: string
  tag: string
  permission: string | null
  fields: Array<{ name: string; type: string; required: boolean }>
}

interface OpenApiOp {
  summary: string
  tags: string[]
  'x-permission'?: string
  requestBody?: { content: { 'application/json': { schema: JsonSchema } } }
}
interface JsonSchema {
  type?: string | string[]
  properties?: Record<string, JsonSchema>
  required?: string[]
  anyOf?: JsonSchema[]
  enum?: unknown[]
}

const typeOf = (s: JsonSchema): string =>
  s.enum
    ? s.enum.map(v => JSON.stringify(v)).join(' | ')
    : s.anyOf
      ? s.anyOf.map(typeOf).join(' | ')
      : [s.type ?? 'any'].flat().join(' | ')

/** The API reference: the server's OpenAPI document, flattened for the reference page. */
export const useApiReferenceStore = defineStore('apiReference', () => {
  const operations = ref<ReferenceOperation[]>([])
  const problem = ref<ApiProblem | null>(null)

  async function load() {
    problem.value = null
    try {
      const doc = await $fetch<{ paths: Record<string, Record<string, OpenApiOp>> }>('/api/v1/openapi.json')
      operations.value = Object.entries(doc.paths).flatMap(([path, ops]) =>
        Object.entries(ops).map(([method, op]) => {
          const schema = op.requestBody?.content['application/json'].schema
          const fields = schema?.properties
            ? Object.entries(schema.properties).map(([name, s]) => ({
                name,
                type: typeOf(s),
                required: schema.required?.includes(name) ?? false,
              }))
            : schema?.anyOf
              ? [
                  {
                    name: '(one of)',
                    type: schema.anyOf.map(a => Object.keys(a.properties ?? {}).join(' + ')).join(' | '),
                    required: true,
                  },
                ]
              : []
          return {
            method: method.toUpperCase(),
            path,
            summary: op.summary,
            tag: op.tags[0] ?? '',
            permission: op['x-permission'] ?? null,
            fields,
          }
        }),
      )
    } catch (error) {
      problem.value = toApiProblem(error)
    }
  }

  return { operations, problem, load }
})
