// The nesting bound on raw JSON handed to a worker (a fuzz finding: 10 000 nested arrays overflowed postMessage).
import { describe, expect, it } from 'vitest'
import { assertJsonDepth, MAX_JSON_DEPTH } from '../../server/utils/jsonDepth'

const nested = (depth: number) => {
  let v: unknown = 1
  for (let i = 0; i < depth; i++) v = [v]
  return v
}

describe('assertJsonDepth', () => {
  it('passes documents up to the limit and scalars', () => {
    expect(() => assertJsonDepth(nested(MAX_JSON_DEPTH))).not.toThrow()
    expect(() => assertJsonDepth({ a: { b: [1, { c: null }] } })).not.toThrow()
    expect(() => assertJsonDepth('text')).not.toThrow()
  })
  it('refuses one level more with a 400 naming the limit, and 100 000 levels without overflowing', () => {
    expect(() => assertJsonDepth(nested(MAX_JSON_DEPTH + 1))).toThrow(/deeper than 64 levels/)
    expect(() => assertJsonDepth(nested(100_000))).toThrow(expect.objectContaining({ statusCode: 400 }))
  })
})
