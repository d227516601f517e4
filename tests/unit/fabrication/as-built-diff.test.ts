// What changed as built, in people's words: element and operating-point names (never ids), numbers through
// shared/format, counts as counts (no percentage), percentages only for quantities.
import { describe, expect, it } from 'vitest'
import { asBuiltChanges, describeChange, type AsBuiltChange } from '#shared/fabrication/asBuiltDiff'
import type { RevisionSummary } from '#shared/types/designs'

const change = (c: Partial<AsBuiltChange>): AsBuiltChange => ({
  what: 'droplet-diameter',
  id: 'sn-1',
  label: 'Droplet diameter at Step nozzle “sn-1”, operating point “Day 1”',
  designed: 40,
  asBuilt: 48,
  unit: 'µm',
  relative: 0.2,
  uncertainty: 0.1,
  exceeds: true,
  ...c,
})

describe('describeChange', () => {
  const NNBSP = '\u202F'
  it.each<[string, Partial<AsBuiltChange>, string]>([
    [
      'a diameter beyond the method',
      {},
      "Droplet diameter at Step nozzle “sn-1”, operating point “Day 1”: 40 → 48 µm (+20 %) — beyond the method's uncertainty",
    ],
    [
      'a diameter within it, 3 significant figures',
      { designed: 38.912, asBuilt: 41.234, relative: 41.234 / 38.912 - 1, exceeds: false },
      'Droplet diameter at Step nozzle “sn-1”, operating point “Day 1”: 38.9 → 41.2 µm (+6 %)',
    ],
    [
      'a diameter across a prefix: each side its own unit',
      { designed: 980, asBuilt: 1020, relative: 1020 / 980 - 1, exceeds: false },
      'Droplet diameter at Step nozzle “sn-1”, operating point “Day 1”: 980 µm → 1.02 mm (+4.1 %)',
    ],
    [
      'a smaller drop: a true minus sign',
      { designed: 40, asBuilt: 34, relative: -0.15, exceeds: true },
      "Droplet diameter at Step nozzle “sn-1”, operating point “Day 1”: 40 → 34 µm (−15 %) — beyond the method's uncertainty",
    ],
    [
      'no forecast as built',
      { asBuilt: null, relative: null, exceeds: false },
      'Droplet diameter at Step nozzle “sn-1”, operating point “Day 1”: 40 µm → no forecast',
    ],
    [
      'a pressure in mbar, grouped digits',
      {
        what: 'inlet-pressure',
        id: 'oil-in',
        label: 'Pressure at inlet “oil-in”, operating point “Day 1”',
        designed: 12345,
        asBuilt: 24690,
        unit: 'mbar',
        relative: 1,
        uncertainty: 0.1,
      },
      `Pressure at inlet “oil-in”, operating point “Day 1”: 12${NNBSP}300 → 24${NNBSP}700 mbar (+100 %) — beyond the method's uncertainty`,
    ],
    [
      'more warnings: a count, no percentage',
      {
        what: 'findings',
        id: 'warnings',
        label: 'Design-rule warnings',
        designed: 1,
        asBuilt: 3,
        unit: '',
        relative: null,
        uncertainty: null,
        exceeds: false,
      },
      'Design rules: 1 → 3 warnings',
    ],
    [
      'one warning',
      {
        what: 'findings',
        id: 'warnings',
        label: 'Design-rule warnings',
        designed: 0,
        asBuilt: 1,
        unit: '',
        relative: null,
        uncertainty: null,
        exceeds: false,
      },
      'Design rules: 0 → 1 warning',
    ],
    [
      'a new error',
      {
        what: 'findings',
        id: 'errors',
        label: 'Design-rule errors',
        designed: 0,
        asBuilt: 2,
        unit: '',
        relative: null,
        uncertainty: null,
        exceeds: true,
      },
      'Design rules: 0 → 2 errors — the as-built chip breaks a rule the drawing kept',
    ],
  ])('%s', (_what, c, line) => {
    expect(describeChange(change(c))).toBe(line)
  })
})

describe('asBuiltChanges', () => {
  const summary = (d: number, p: number, warnings: number): RevisionSummary => ({
    junctionKinds: [],
    counts: { channels: 0, components: 0, ports: 0, layers: 0 },
    operatingPoint: 'op-1',
    forecastError: null,
    processId: 'film-mask-soft-litho',
    junctions: [
      { id: 'tj-1', kind: 't-junction', regime: 'squeezing', dropletDiameterUm: d, frequencyHz: 100, valid: true },
      { id: 'arr-1[3]', kind: 'step-array', regime: 'step', dropletDiameterUm: d, frequencyHz: 100, valid: true },
    ],
    inlets: [{ portId: 'oil-in', pressureMbar: p }],
    findings: { errors: 0, warnings, infos: 0 },
  })
  const doc = {
    components: [
      { id: 'tj-1', kind: 't-junction' },
      { id: 'arr-1', kind: 'step-array' },
    ],
    ports: [{ id: 'oil-in', kind: 'inlet' }],
    operatingPoints: [{ id: 'op-1', name: 'Cells in 40 µm drops' }],
  }

  it('names the junction, the nozzle of an array, the inlet and the operating point by their names', () => {
    const changes = asBuiltChanges(summary(40, 100, 1), summary(44, 200, 3), doc)
    expect(changes.map(c => c.label)).toEqual([
      'Droplet diameter at T-junction “tj-1”, operating point “Cells in 40 µm drops”',
      'Droplet diameter at Step nozzle array “arr-1”, nozzle 4, operating point “Cells in 40 µm drops”',
      'Pressure at inlet “oil-in”, operating point “Cells in 40 µm drops”',
      'Design-rule errors',
      'Design-rule warnings',
    ])
    expect(changes.every(c => !c.label.includes('op-1'))).toBe(true)
    // Ids stay in the data for scripts; the count has no relative change.
    expect(changes.map(c => c.id)).toEqual(['tj-1', 'arr-1[3]', 'oil-in', 'errors', 'warnings'])
    expect(changes.find(c => c.id === 'warnings')).toMatchObject({
      designed: 1,
      asBuilt: 3,
      relative: null,
      exceeds: false,
    })
    // +10 % on a T-junction is inside its ±15 %; a doubled pressure is beyond ±10 %.
    expect(changes.find(c => c.id === 'tj-1')).toMatchObject({ exceeds: false })
    expect(changes.find(c => c.id === 'oil-in')).toMatchObject({ relative: 1, exceeds: true })
  })

  it('quotes the operating point id only when the document gives it no name', () => {
    const changes = asBuiltChanges(summary(40, 100, 0), summary(40, 100, 0), {
      operatingPoints: [{ id: 'op-1', name: ' ' }],
    })
    expect(changes[0]!.label).toBe('Droplet diameter at tj-1, operating point “op-1”')
  })
})
