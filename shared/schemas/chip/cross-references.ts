import type { z } from 'zod'
import type { Component } from './components'
import type { Port } from './ports'
import type { TerminalRef } from './primitives'
import { terminalNames } from './terminals'
import type { ChipDocumentShape } from './document-shape'

type Ctx = z.core.$RefinementCtx
type Path = (string | number)[]

const issue = (ctx: Ctx, path: Path, message: string) =>
  ctx.addIssue({ code: 'custom', path, message, params: { final: true } })

/** Every cross-reference check of the document; each message names the element and the fix. */
export function checkCrossReferences(doc: ChipDocumentShape, ctx: Ctx): void {
  const layerIds = new Set<string>()
  doc.layers.forEach((l, i) => {
    if (layerIds.has(l.id)) issue(ctx, ['layers', i, 'id'], `Duplicate layer id "${l.id}": give each layer its own id`)
    layerIds.add(l.id)
  })
  const hasLayer = (id: string, path: Path, what: string) => {
    if (!layerIds.has(id))
      issue(
        ctx,
        path,
        `Unknown layer "${id}" on ${what}: use one of ${[...layerIds].map(x => `"${x}"`).join(', ') || '(no layers defined)'}`,
      )
  }

  // Ports, channels, components and marks share one id space: channels refer to them by id.
  const elements = new Map<string, Port | Component | null>()
  const claim = (id: string, path: Path, what: string, el: Port | Component | null) => {
    if (elements.has(id))
      issue(ctx, path, `Duplicate id "${id}" on ${what}: every port, channel, component and mark needs its own id`)
    else elements.set(id, el)
  }
  doc.ports.forEach((p, i) => {
    claim(p.id, ['ports', i, 'id'], `port "${p.id}"`, p)
    hasLayer(p.layerId, ['ports', i, 'layerId'], `port "${p.id}"`)
    if (p.kind === 'outlet' && p.feed)
      issue(ctx, ['ports', i, 'feed'], `Outlet port "${p.id}" cannot have a feed: remove "feed" or make it an inlet`)
  })
  doc.components.forEach((c, i) => {
    claim(c.id, ['components', i, 'id'], `${c.kind} "${c.id}"`, c)
    const fields = ['layerId', 'reservoirLayerId', 'supplyLayerId'] as const
    for (const f of fields) {
      const v = (c as Record<string, unknown>)[f]
      if (typeof v === 'string') hasLayer(v, ['components', i, f], `${c.kind} "${c.id}"`)
    }
  })
  doc.channels.forEach((ch, i) => {
    claim(ch.id, ['channels', i, 'id'], `channel "${ch.id}"`, null)
    hasLayer(ch.layerId, ['channels', i, 'layerId'], `channel "${ch.id}"`)
  })
  doc.marks.forEach((m, i) => {
    claim(m.id, ['marks', i, 'id'], `mark "${m.id}"`, null)
    m.layerIds.forEach((l, j) => hasLayer(l, ['marks', i, 'layerIds', j], `mark "${m.id}"`))
  })

  const checkRef = (ref: TerminalRef | undefined, path: Path, channelId: string) => {
    if (!ref) return
    const target = elements.get(ref.element)
    if (target === undefined) {
      issue(
        ctx,
        [...path, 'element'],
        `Channel "${channelId}" refers to unknown element "${ref.element}": use the id of a port or component`,
      )
    } else if (target === null) {
      issue(
        ctx,
        [...path, 'element'],
        `Channel "${channelId}" refers to "${ref.element}", which has no terminals: attach it to a port or component`,
      )
    } else {
      const names = terminalNames(target)
      if (!names.includes(ref.terminal)) {
        issue(
          ctx,
          [...path, 'terminal'],
          `Channel "${channelId}" refers to terminal "${ref.terminal}" on "${ref.element}", which has none by that name: use one of ${names.map(n => `"${n}"`).join(', ')}`,
        )
      }
    }
  }
  doc.channels.forEach((ch, i) => {
    checkRef(ch.start, ['channels', i, 'start'], ch.id)
    checkRef(ch.end, ['channels', i, 'end'], ch.id)
  })

  const opIds = new Set<string>()
  doc.operatingPoints.forEach((op, i) => {
    if (opIds.has(op.id))
      issue(ctx, ['operatingPoints', i, 'id'], `Duplicate operating point id "${op.id}": give each its own id`)
    opIds.add(op.id)
    const seen = new Set<string>()
    op.inlets.forEach((s, j) => {
      const path = ['operatingPoints', i, 'inlets', j, 'portId']
      const p = elements.get(s.portId)
      if (!p || !('punchDiameter' in p))
        issue(ctx, path, `Operating point "${op.id}" sets unknown port "${s.portId}": use the id of an inlet port`)
      else if (p.kind !== 'inlet')
        issue(ctx, path, `Operating point "${op.id}" drives outlet port "${s.portId}": only inlets can be driven`)
      if (seen.has(s.portId))
        issue(ctx, path, `Operating point "${op.id}" sets port "${s.portId}" twice: keep one setting`)
      seen.add(s.portId)
    })
  })
  if (doc.activeOperatingPoint !== undefined && !opIds.has(doc.activeOperatingPoint)) {
    issue(
      ctx,
      ['activeOperatingPoint'],
      `Active operating point "${doc.activeOperatingPoint}" does not exist: use one of ${[...opIds].map(x => `"${x}"`).join(', ') || '(none defined)'}`,
    )
  }
}
