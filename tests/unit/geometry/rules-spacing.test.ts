import { describe, expect, it } from 'vitest'
import { BUILT_IN_PROCESSES, checkDesignRules } from '~~/geometry/rules'
import type { Finding } from '~~/geometry/rules'
import { generateParallelChip } from '~~/geometry/arrays'
import { channelsDoc, fixture, moved } from './helpers'

// Known answers from the process data in geometry/rules/processes.ts (film mask: min gap 20 µm, min feature
// 20 µm — common practice, no source). Invariance under rigid motion follows earcut's practice of rerunning
// each fixture at several rotations.
const film = BUILT_IN_PROCESSES.find(p => p.id === 'film-mask-soft-litho')!
const summary = (fs: Finding[]) => fs.map(f => `${f.severity} ${f.id}`).sort()

function pair(gap: number, width = 50) {
  const y2 = 1000 + width + gap
  return channelsDoc(
    [
      {
        id: 'upper',
        layerId: 'L',
        width,
        points: [
          { x: 1000, y: y2 },
          { x: 4000, y: y2 },
        ],
      },
      {
        id: 'lower',
        layerId: 'L',
        width,
        points: [
          { x: 1000, y: 1000 },
          { x: 4000, y: 1000 },
        ],
      },
    ],
    20,
  )
}

describe('minimum gap and width', () => {
  it('two channels exactly at the minimum gap pass; 1 µm closer fail, naming both', () => {
    expect(checkDesignRules(pair(film.minGap), film).filter(f => f.rule === 'min-gap')).toEqual([])
    const close = checkDesignRules(pair(film.minGap - 1), film).filter(f => f.rule === 'min-gap')
    expect(close).toHaveLength(1)
    expect(close[0]!.elements).toEqual(['lower', 'upper'])
    expect(close[0]!.severity).toBe('error')
    expect(close[0]!.message).toMatch(/Gap of 19 µm .* move the features at least 20 µm apart/)
    expect(close[0]!.location.y).toBeCloseTo(1000 + 25 + 19 / 2, 6)
  })
  it('a channel exactly at the minimum width passes; 1 µm narrower fails', () => {
    const one = (w: number) =>
      channelsDoc(
        [
          {
            id: 'thin',
            layerId: 'L',
            width: w,
            points: [
              { x: 1000, y: 1000 },
              { x: 3000, y: 1000 },
            ],
          },
        ],
        20,
      )
    expect(checkDesignRules(one(film.minFeature), film).filter(f => f.rule === 'min-width')).toEqual([])
    const thin = checkDesignRules(one(film.minFeature - 1), film).filter(f => f.rule === 'min-width')
    expect(thin.map(f => f.elements)).toEqual([['thin']])
  })
  it('a narrow notch inside one merged part (a U-turn too tight) is a gap', () => {
    const doc = channelsDoc(
      [
        {
          id: 'hairpin',
          layerId: 'L',
          width: 40,
          points: [
            { x: 1000, y: 1000 },
            { x: 3000, y: 1000 },
            { x: 3000, y: 1050 },
            { x: 1000, y: 1050 },
          ],
        },
      ],
      20,
    )
    const gaps = checkDesignRules(doc, film).filter(f => f.rule === 'min-gap')
    expect(gaps.map(f => f.elements)).toEqual([['hairpin']])
    expect(gaps[0]!.message).toMatch(/Gap of 10 µm/)
  })
  it('tall thin walls between deep channels are flagged (depth/width > 4)', () => {
    const deep = (gap: number) =>
      channelsDoc(
        [
          {
            id: 'a',
            layerId: 'L',
            width: 100,
            points: [
              { x: 1000, y: 1000 },
              { x: 3000, y: 1000 },
            ],
          },
          {
            id: 'b',
            layerId: 'L',
            width: 100,
            points: [
              { x: 1000, y: 1100 + gap },
              { x: 3000, y: 1100 + gap },
            ],
          },
        ],
        200,
      )
    expect(checkDesignRules(deep(50), film).filter(f => f.rule === 'tall-thin-wall')).toEqual([])
    expect(
      checkDesignRules(deep(40), film)
        .filter(f => f.rule === 'tall-thin-wall')
        .map(f => f.elements),
    ).toEqual([['a', 'b']])
  })
  it('the spatial index and the naive all-pairs check agree', () => {
    const doc = generateParallelChip({ nozzles: 24, nozzlesPerBank: 12, pitch: 45 })
    expect(checkDesignRules(doc, film, { naive: true })).toEqual(checkDesignRules(doc, film))
  })
})

describe('rotated and moved copies give the same findings', () => {
  const cases = {
    'gap pair at the limit': pair(film.minGap),
    'gap pair 1 µm too close': pair(film.minGap - 1),
    'T-junction fixture': fixture('t-junction-basic.json'),
    'parallel array with tight pitch': generateParallelChip({ nozzles: 6, pitch: 45, nozzleWidth: 30 }),
  }
  for (const [name, doc] of Object.entries(cases)) {
    it(name, () => {
      const base = summary(checkDesignRules(doc, film))
      for (const [deg, shift] of [
        [90, { x: 0, y: 0 }],
        [37, { x: 1234.5, y: -87 }],
        [180, { x: -500, y: 300 }],
        [291, { x: 10, y: 10 }],
      ] as const) {
        expect(summary(checkDesignRules(moved(doc, deg, shift), film))).toEqual(base)
      }
    })
  }
})

// Sizing (opening by half the minimum width, closing by half the gap, geometry/rules/sizing.ts) against the
// edge-pair check it replaced as the default: the same findings — ids, messages, locations — on every
// fixture, moved and rotated too. The edge-pair check is the reference (classic edge-pair DRC, spacing.ts).
describe('sizing gives the edge-pair findings', () => {
  const cases = {
    'gap pair at the limit': pair(film.minGap),
    'gap pair 1 µm too close': pair(film.minGap - 1),
    'narrow pair (15 µm channels)': pair(film.minGap - 5, 15),
    'T-junction fixture': fixture('t-junction-basic.json'),
    'parallel array with tight pitch': generateParallelChip({ nozzles: 6, pitch: 45, nozzleWidth: 30 }),
    '48-nozzle array in two banks': generateParallelChip({ nozzles: 48, nozzlesPerBank: 24, pitch: 45 }),
    'deep walls': channelsDoc(
      [
        {
          id: 'a',
          layerId: 'L',
          width: 100,
          points: [
            { x: 1000, y: 1000 },
            { x: 3000, y: 1000 },
          ],
        },
        {
          id: 'b',
          layerId: 'L',
          width: 100,
          points: [
            { x: 1000, y: 1140 },
            { x: 3000, y: 1140 },
            { x: 3000, y: 3000 },
          ],
        },
        {
          id: 'thin',
          layerId: 'L',
          width: 12,
          points: [
            { x: 1000, y: 4000 },
            { x: 3000, y: 4200 },
          ],
        },
      ],
      200,
    ),
  }
  const flagged = [
    'gap pair 1 µm too close',
    'narrow pair (15 µm channels)',
    'parallel array with tight pitch',
    '48-nozzle array in two banks',
    'deep walls',
  ]
  for (const [name, doc] of Object.entries(cases)) {
    it(name, () => {
      for (const [deg, shift] of [
        [0, { x: 0, y: 0 }],
        [90, { x: 0, y: 0 }],
        [37, { x: 1234.5, y: -87 }],
        [180, { x: -500, y: 300 }],
        [291, { x: 10, y: 10 }],
      ] as const) {
        const d = moved(doc, deg, shift)
        const sizing = checkDesignRules(d, film, { spacing: 'sizing' })
        const edges = checkDesignRules(d, film, { spacing: 'edges' })
        if (deg % 90 === 0) expect(sizing).toEqual(edges)
        else {
          // Off the axes, many edge pairs of two parallel edges tie within rounding noise and which one is kept
          // (hence the location along the gap) is arbitrary; ids, messages and elements must still agree.
          const strip = (fs: typeof edges) => fs.map(({ location: _l, ...f }) => f)
          expect(strip(sizing)).toEqual(strip(edges))
        }
        if (flagged.includes(name))
          expect(edges.some(f => ['min-gap', 'min-width', 'tall-thin-wall'].includes(f.rule))).toBe(true)
      }
    })
  }
})
