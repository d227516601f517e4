// Multipart bodies (server/utils/multipart.ts): parts and fields come back as sent (the body encoded by the platform's
// own FormData, as a browser sends it), a large file is parsed in slices that give the event loop a turn between
// them (counted, not timed), and a cut-off body is a 400 in words.
import { describe, expect, it } from 'vitest'
import { parseMultipart } from '../../server/utils/multipart'

async function encode(form: FormData): Promise<{ body: Buffer; type: string }> {
  const response = new Response(form)
  return { body: Buffer.from(await response.arrayBuffer()), type: response.headers.get('content-type')! }
}

describe('parseMultipart', () => {
  it('returns the file with its name and bytes, and the text fields', async () => {
    const bytes = new Uint8Array(1000).map((_, i) => (i * 37) % 256)
    const form = new FormData()
    form.set('image', new Blob([bytes]), 'drops.png')
    form.set('umPerPx', '0.8')
    const { body, type } = await encode(form)
    const parts = await parseMultipart(body, type)
    const file = parts.find(p => p.name === 'image')!
    expect(file.filename).toBe('drops.png')
    expect(new Uint8Array(file.data)).toEqual(bytes)
    const field = parts.find(p => p.name === 'umPerPx')!
    expect(field.filename).toBeUndefined()
    expect(field.data.toString('utf8')).toBe('0.8')
  })

  it('parses a 6 MiB file in slices, letting other work run in between', async () => {
    const bytes = new Uint8Array(6 * 1024 * 1024).map((_, i) => (i * 2654435761) >>> 24)
    const form = new FormData()
    form.set('image', new Blob([bytes]), 'big.tiff')
    const { body, type } = await encode(form)
    let turns = 0
    let ticking = true
    const tick = () => {
      turns++
      if (ticking) setImmediate(tick)
    }
    setImmediate(tick)
    const parts = await parseMultipart(body, type)
    ticking = false
    expect(parts[0]!.data.equals(Buffer.from(bytes))).toBe(true)
    // One slice per MiB: other callbacks ran between the slices rather than after the whole body.
    expect(turns).toBeGreaterThanOrEqual(5)
  })

  it('refuses a body cut before its closing boundary, and a type without a boundary, in words', async () => {
    const form = new FormData()
    form.set('image', new Blob([new Uint8Array(100)]), 'x.png')
    const { body, type } = await encode(form)
    await expect(parseMultipart(body.subarray(0, body.length - 20), type)).rejects.toMatchObject({
      statusCode: 400,
      message: expect.stringContaining('malformed'),
    })
    await expect(parseMultipart(body, 'multipart/form-data')).rejects.toMatchObject({
      statusCode: 400,
      message: expect.stringContaining('boundary'),
    })
  })
})
