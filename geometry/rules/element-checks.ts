import type { ChipDocument, Component, Terminal } from '#shared/schemas/chip'
import { componentTerminals, portTerminals } from '#shared/schemas/chip'
import type { FabricationProcess, Finding } from './types'
import { findingId } from './types'

// Kobayashi et al. 2004, Langmuir 20, 9868: critical nozzle width/depth ≈ 3–3.5 — from memory, NOT verified: a search of
// published sources found neither the paper's text nor this value; treat 3 as a screening value until checked.
const STEP_ASPECT = 3
const STEP_DEPTH_RATIO = 4 // reservoir ≥ ~4 nozzle depths so the drop (≈ 4 nozzle depths across) is unconfined — common practice, no source

/** Widths a component draws, with the layer each sits on (for the roof-sag check). */
function componentWidths(c: Component): { label: string; width: number; layerId: string }[] {
  switch (c.kind) {
    case 't-junction':
      return [{ label: 'main channel', width: c.mainWidth, layerId: c.layerId }]
    case 'flow-focusing':
      return [
        { label: 'outlet', width: c.outletWidth, layerId: c.layerId },
        { label: 'continuous arms', width: c.continuousWidth, layerId: c.layerId },
      ]
    case 'y-junction':
      return [{ label: 'outlet', width: c.outletWidth, layerId: c.layerId }]
    case 'step-nozzle':
      return [{ label: 'reservoir', width: c.reservoirWidth, layerId: c.reservoirLayerId }]
    case 'step-array':
      return [
        { label: 'supply', width: c.supplyWidth, layerId: c.supplyLayerId },
        { label: 'reservoir', width: c.reservoirWidth, layerId: c.reservoirLayerId },
      ]
    case 'serpentine':
      return [{ label: 'channel', width: c.width, layerId: c.layerId }]
  }
}

/** Per-element rules that need no outlines: depth window, roof sag, step nozzles, channel ends on terminals. */
export function elementFindings(doc: ChipDocument, p: FabricationProcess): Finding[] {
  const out: Finding[] = []
  const depth = new Map(doc.layers.map(l => [l.id, l.depth]))
  const add = (
    rule: string,
    severity: Finding['severity'],
    message: string,
    elements: string[],
    at: { x: number; y: number },
  ) => out.push({ id: findingId(rule, elements), rule, severity, message, elements, location: { x: at.x, y: at.y } })

  for (const l of doc.layers) {
    if (l.depth < p.minDepth || l.depth > p.maxDepth) {
      add(
        'depth-window',
        'error',
        `Layer "${l.id}" is ${l.depth} µm deep, outside this process's ${p.minDepth}–${p.maxDepth} µm: choose a depth in that window or another process`,
        [l.id],
        { x: 0, y: 0 },
      )
    }
  }
  const roof = (id: string, label: string, width: number, layerId: string, at: { x: number; y: number }) => {
    const h = depth.get(layerId)
    if (h === undefined || width / h <= p.maxWidthToDepth) return
    add(
      'roof-collapse',
      'warning',
      `${label} of "${id}" is ${width} µm wide on a ${h} µm deep layer (width/depth ${(width / h).toFixed(1)} > ${p.maxWidthToDepth}): the roof may sag onto the floor; narrow it, add support posts or use a deeper layer`,
      [id],
      at,
    )
  }
  for (const ch of doc.channels) roof(ch.id, 'Channel', ch.width, ch.layerId, ch.points[0]!)
  for (const c of doc.components) {
    for (const w of componentWidths(c))
      roof(c.id, w.label[0]!.toUpperCase() + w.label.slice(1), w.width, w.layerId, c.position)
    if (c.kind === 'step-nozzle' || c.kind === 'step-array') {
      const hn = depth.get(c.layerId) ?? 0
      const hr = depth.get(c.reservoirLayerId) ?? 0
      if (hr <= hn) {
        add(
          'step-no-step',
          'error',
          `${c.kind} "${c.id}": the reservoir layer (${hr} µm) must be deeper than the nozzle layer (${hn} µm) to form a step; put the reservoir on a deeper layer`,
          [c.id],
          c.position,
        )
      } else if (hr < STEP_DEPTH_RATIO * hn) {
        add(
          'step-shallow-reservoir',
          'warning',
          `${c.kind} "${c.id}": reservoir is ${hr} µm deep, under ${STEP_DEPTH_RATIO}× the ${hn} µm nozzle depth; drops may stay confined: deepen the reservoir to ≥ ${STEP_DEPTH_RATIO * hn} µm`,
          [c.id],
          c.position,
        )
      }
      if (hn > 0 && c.nozzleWidth / hn < STEP_ASPECT) {
        add(
          'step-nozzle-aspect',
          'warning',
          `${c.kind} "${c.id}": nozzle width/depth is ${(c.nozzleWidth / hn).toFixed(2)}, below about ${STEP_ASPECT} where step emulsification becomes unstable: widen the nozzle to ≥ ${STEP_ASPECT * hn} µm or make it shallower`,
          [c.id],
          c.position,
        )
      }
    }
  }
  out.push(...terminalFindings(doc))
  return out
}

// A step in width where a channel meets a component's arm changes the junction's effective geometry (and the
// forecast, which uses the arm's width). Differences under 2 % are drawing round-off — common practice, no source.
const WIDTH_STEP_TOLERANCE = 0.02
const widthStep = (channel: number, arm: number, feedsNozzle: boolean) =>
  (feedsNozzle ? arm - channel : Math.abs(channel - arm)) > WIDTH_STEP_TOLERANCE * arm
const fmtUm = (v: number) => (Number.isInteger(v) ? String(v) : v.toFixed(1))

/**
 * A channel end that claims a terminal but does not sit on it (> 0.5 µm away) breaks the drawing and the network;
 * one that sits on a component's terminal with another width makes a step there (a warning; ports are punches).
 */
function terminalFindings(doc: ChipDocument): Finding[] {
  const terminals = new Map<string, Map<string, Terminal>>()
  for (const c of doc.components) terminals.set(c.id, new Map(componentTerminals(c).map(t => [t.name, t])))
  for (const port of doc.ports) terminals.set(port.id, new Map(portTerminals(port).map(t => [t.name, t])))
  const isComponent = new Set(doc.components.map(c => c.id))
  // A step nozzle is the constriction: a supply wider than the nozzle feeding its entry is the design, not a slip.
  const nozzleEntries = new Set(doc.components.filter(c => c.kind === 'step-nozzle').map(c => `${c.id}/dispersed`))
  const out: Finding[] = []
  for (const ch of doc.channels) {
    for (const [end, ref, pt] of [
      ['start', ch.start, ch.points[0]!],
      ['end', ch.end, ch.points[ch.points.length - 1]!],
    ] as const) {
      const terminal = ref && terminals.get(ref.element)?.get(ref.terminal)
      if (!terminal) continue
      const t = { ...terminal.position, width: terminal.width }
      const gap = Math.hypot(t.x - pt.x, t.y - pt.y)
      if (
        gap <= 0.5 &&
        isComponent.has(ref.element) &&
        widthStep(ch.width, t.width, nozzleEntries.has(`${ref.element}/${ref.terminal}`))
      ) {
        const elements = [ch.id, ref.element]
        out.push({
          id: findingId(`terminal-width-step-${end}`, elements),
          rule: 'terminal-width-step',
          severity: 'warning',
          elements,
          location: { x: pt.x, y: pt.y },
          message: `Channel "${ch.id}" is ${fmtUm(ch.width)} µm wide where it joins terminal "${ref.terminal}" of "${ref.element}", which is ${fmtUm(t.width)} µm wide: the width steps at the joint; make the channel ${fmtUm(t.width)} µm wide or change the ${ref.terminal} width of "${ref.element}"`,
        })
      }
      if (gap > 0.5) {
        const elements = [ch.id, ref.element]
        out.push({
          id: findingId(`terminal-mismatch-${end}`, elements),
          rule: 'terminal-mismatch',
          severity: 'error',
          elements,
          location: { x: pt.x, y: pt.y },
          message: `Channel "${ch.id}" ${end}s ${gap.toFixed(1)} µm away from terminal "${ref.terminal}" of "${ref.element}": move its ${end} point to (${t.x.toFixed(1)}, ${t.y.toFixed(1)}) µm`,
        })
      }
    }
  }
  return out
}
