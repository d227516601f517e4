import { describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import example from '../fixtures/forecast/t-junction-request.json' // the example of docs/forecast-api.md

describe('POST /api/v1/forecast and GET /api/v1/liquids (real server)', () => {
  it('answers the documented junction example with cited quantities', async () => {
    const api = await signedIn('experimenter@quillmere.example')
    const res = await api.post('/api/v1/forecast', example)
    expect(res.status).toBe(200)
    for (const key of [
      'capillaryNumber',
      'reynoldsNumber',
      'laplacePressure',
      'entryPressure',
      'dropletVolume',
      'dropletDiameter',
      'frequency',
    ]) {
      const q = res.json[key]
      expect(q, key).toMatchObject({
        unit: expect.any(String),
        method: expect.any(String),
        source: expect.any(String),
        valid: expect.any(Boolean),
      })
      expect(Number.isFinite(q.value), key).toBe(true)
    }
    // Ca = μc·U/γ with U = Qc/(w·h): 3e-3 Pa·s × (10 µL/min ÷ (100 µm × 50 µm)) / 5e-3 N/m = 0.02
    expect(res.json.capillaryNumber.value).toBeCloseTo((3e-3 * (10e-9 / 60)) / (100e-6 * 50e-6) / 5e-3, 6)
    // Beyond squeezing the length falls with Ca: the squeezing length L/w = 1 + α·Qd/Qc (Garstecki et al. 2006,
    // α = 1: 150 µm) scaled by (Ca/0.01)^−0.2 (power-law form of Xu et al. 2008; exponent from memory, see the core).
    expect(res.json.dropletLength.value).toBeCloseTo(150e-6 * (0.02 / 0.01) ** -0.2, 9)
    expect(res.json.dropletLength.method).toContain('xu-2008-transition-dripping')
    // Ca = 0.02 lies above the squeezing threshold (Ca ≈ 0.015, De Menech et al. 2008): the size must come flagged
    expect(res.json.regime.value).not.toBe('squeezing')
    expect(res.json.dropletLength.valid).toBe(false)
    expect(res.json.warnings.length).toBeGreaterThan(0)
  })

  it('names the bad field: a width in kilograms, a string that is not a quantity', async () => {
    const api = await signedIn('designer@quillmere.example')
    const kg = await api.post('/api/v1/forecast', { ...example, junction: { ...example.junction, mainWidth: '5 kg' } })
    expect(kg.status).toBe(400)
    expect(kg.json.data.issues.map((i: { path: string }) => i.path)).toContain('junction.mainWidth')
    const junk = await api.post('/api/v1/forecast', { ...example, flow: { ...example.flow, dispersed: 'lots' } })
    expect(junk.status).toBe(400)
    expect(JSON.stringify(junk.json.data.issues)).toContain('flow.dispersed')
    const negative = await api.post('/api/v1/forecast', {
      ...example,
      junction: { ...example.junction, depth: '-5 um' },
    })
    expect(negative.status).toBe(400)
  })

  it('answers a network, and a floating one with 400 rather than NaN', async () => {
    const api = await signedIn('designer@quillmere.example')
    const channel = (id: string, from: string, to: string) => ({
      id,
      from,
      to,
      width: '100 um',
      depth: '50 um',
      length: '10 mm',
    })
    const ok = await api.post('/api/v1/forecast', {
      network: {
        channels: [channel('a', 'in', 'mid'), channel('b', 'mid', 'out')],
        sources: [
          { node: 'in', pressure: '100 mbar' },
          { node: 'out', pressure: '0 mbar' },
        ],
        liquid: { liquid: 'water' },
      },
    })
    expect(ok.status).toBe(200)
    const mid = ok.json.nodes.find((n: { id: string }) => n.id === 'mid')
    expect(mid.pressure.value ?? mid.pressure).toBeCloseTo(5000, 3) // two equal resistances in series halve 100 mbar = 10 kPa
    const floating = await api.post('/api/v1/forecast', {
      network: {
        channels: [channel('a', 'in', 'mid'), channel('c', 'x', 'y')],
        sources: [
          { node: 'in', pressure: '100 mbar' },
          { node: 'mid', pressure: '0 mbar' },
        ],
        liquid: { liquid: 'water' },
      },
    })
    expect(floating.status).toBe(400)
    expect(JSON.stringify(floating.json)).not.toContain('NaN')
  })

  it('lists the liquids library with sources, and needs a session', async () => {
    const api = await signedIn('fabricator@brackenfold.example')
    const res = await api.get('/api/v1/liquids')
    expect(res.status).toBe(200)
    const ids = res.json.liquids.map((l: { id: string }) => l.id)
    expect(ids).toEqual(expect.arrayContaining(['water', 'glycerol-water', 'n-hexadecane']))
    expect((await new ApiClient().get('/api/v1/liquids')).status).toBe(401)
    expect((await new ApiClient().post('/api/v1/forecast', example)).status).toBe(401)
  })

  it('refuses a body over the documented limit with 413', async () => {
    const api = await signedIn('designer@quillmere.example')
    const huge = JSON.stringify({ document: { name: 'x'.repeat(9 * 1024 * 1024) } })
    expect((await api.request('POST', '/api/v1/forecast', huge)).status).toBe(413)
  })
})
