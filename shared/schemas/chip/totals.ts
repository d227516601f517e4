// Document totals: how many elements of each kind, channel points and drawn pieces one chip may have
// (./limits.ts). Checked on the whole document by the full parse and by the incremental one alike.
import type { z } from 'zod'
import type { Component } from './components'
import type { ChipDocumentShape } from './document-shape'
import { CHIP_LIMITS as L, shownLimit } from './limits'

const PER_KIND = {
  layers: 'layers',
  ports: 'ports',
  channels: 'channels',
  components: 'components',
  marks: 'marks',
  operatingPoints: 'operating points',
} as const

/** Pieces a component is drawn with (geometry/outlines/components.ts): arms, nozzles, runs and turns. */
function componentPieces(c: Component): number {
  switch (c.kind) {
    case 't-junction':
      return 2
    case 'flow-focusing':
      return 4
    case 'y-junction':
      return 4
    case 'step-nozzle':
      return 2
    case 'step-array':
      return c.nozzleCount + 2
    case 'serpentine':
      return 2 * c.turns + 1
  }
}

/**
 * A chip with more drawn pieces than this is "large": its summaries and (from the revision page) its mask DXF are
 * made by background jobs (about 1,200 nozzles; DW_SUMMARY_INLINE_PIECES overrides it for summaries).
 */
export const LARGE_CHIP_PIECES = 5000

/**
 * Drawn pieces of the whole document, as geometry/outlines makes them: a channel of n points is n − 1
 * segments and n − 2 joins, each punch one, each alignment cross two per layer it is drawn on.
 */
export function documentPieceCount(
  doc: Pick<ChipDocumentShape, 'channels' | 'components' | 'ports' | 'marks'>,
): number {
  let n = doc.ports.length
  for (const ch of doc.channels) n += Math.max(1, 2 * ch.points.length - 3)
  for (const c of doc.components) n += componentPieces(c)
  for (const m of doc.marks) n += m.kind === 'cross' ? 2 * (1 + m.layerIds.length) : 1
  return n
}

/** Adds an issue for every total over its limit; each message says the limit and what to do. */
export function checkDocumentTotals(doc: ChipDocumentShape, ctx: z.core.$RefinementCtx): void {
  const issue = (path: (string | number)[], message: string) =>
    ctx.addIssue({ code: 'custom', path, message, params: { final: true } })
  for (const [list, noun] of Object.entries(PER_KIND) as [keyof typeof PER_KIND, string][]) {
    const count = doc[list].length
    if (count > L[list])
      issue(
        [list],
        `A chip can have at most ${shownLimit(L[list])} ${noun} (got ${shownLimit(count)}): split it into several designs`,
      )
  }
  const points = doc.channels.reduce((s, ch) => s + ch.points.length, 0)
  if (points > L.channelPoints) {
    issue(
      ['channels'],
      `A chip's channels can have at most ${shownLimit(L.channelPoints)} points in all (got ${shownLimit(points)}): simplify the channels or split the design`,
    )
  }
  const pieces = documentPieceCount(doc)
  if (pieces > L.pieces) {
    issue(
      [],
      `A chip can be drawn with at most ${shownLimit(L.pieces)} pieces (channel segments, nozzles, serpentine turns, ports, marks; got ${shownLimit(pieces)}): split it into several designs`,
    )
  }
}
