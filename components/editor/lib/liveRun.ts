// One live-forecast run, the same in the worker and (where there is no worker) on the main thread; and the
// document patches the page sends the worker instead of the whole document after every edit.
import type { ChipDocument } from '#shared/schemas/chip'
import {
  forecastDocument,
  summarizeForecast,
  type DocumentForecast,
  type ForecastSummary,
} from '#shared/physics/document'
import { checkDesignRules, resolveProcess, type Finding, type LabProcessData } from '~~/geometry/rules'
import { mergeLibrary, type LabLiquidsData, type LiquidLibrary } from '#shared/physics/liquids'

/** The lab's own liquids, pairs and processes (plain data, GET /api/v1/liquids?lab=); null → built-in only. */
export type LiveLab = LabLiquidsData & { processes: LabProcessData[] }

/**
 * What the page sends the worker's `run` and `warm` (forecastApi.ts). `doc`: the whole document (the first
 * request, or after a reset); `patch`: what changed since the previous request's document. `processId`: also check
 * the design rules of that process, answered after the forecast. `lab`: the lab's library, sent when it changes
 * (the worker keeps the last one; undefined = unchanged).
 */
export interface LiveRequest {
  seq: number
  doc?: ChipDocument
  patch?: DocPatch
  processId?: string | null
  focus?: string | null
  lab?: LiveLab | null
}
/** The junctions of the focused element from the worker's last forecast (forecastApi.ts, `refocus`). */
export interface FocusAnswer {
  seq: number
  focus: string | null
  junctions: DocumentForecast['junctions']
}
export interface LiveAnswer {
  seq: number
  forecast: DocumentForecast | null
  summary: ForecastSummary | null
  error: string | null
}
export interface RulesAnswer {
  seq: number
  findings: Finding[]
}

/** The forecast with the network's node and channel lists left empty (kept: inlets, outlets, uniformity, margins). */
export function leanForecast(f: DocumentForecast): DocumentForecast {
  return { ...f, network: { ...f.network, nodes: [], channels: [] } }
}

/**
 * The forecast with the junctions of one element only (the selected part, whose table and plots the editor
 * shows). On 4,096 nozzles the whole list is ≈ 29 MB to copy from the worker (≈ 200 ms on the main thread); the
 * canvas labels come from the summary, which keeps every junction.
 */
export function focusOn(f: DocumentForecast | null, focus: string | null | undefined): DocumentForecast | null {
  return f && { ...f, junctions: focus ? f.junctions.filter(j => j.element === focus) : [] }
}

let merged: { lab: string; library: LiquidLibrary } | undefined
/** The merged library, rebuilt only when the lab's liquids or pairs change. */
function libraryFor(lab: LabLiquidsData | null | undefined): LiquidLibrary | undefined {
  if (!lab) return undefined
  const key = JSON.stringify([lab.liquids, lab.pairs])
  if (merged?.lab !== key) merged = { lab: key, library: mergeLibrary({ liquids: lab.liquids, pairs: lab.pairs }) }
  return merged.library
}

export function runLiveForecast(doc: ChipDocument, seq: number, lab?: LabLiquidsData | null): LiveAnswer {
  try {
    const library = libraryFor(lab)
    const forecast = forecastDocument(doc, undefined, library ? { library } : {})
    // Parts and channels not wired yet are left out by the forecast itself, with a warning naming each.
    const left = forecast.warnings
      .filter(w => w.code === 'component-unconnected' || w.code === 'channels-unconnected')
      .map(w => (w as { element?: string }).element)
    const note = left.length ? `Not yet connected, so not forecast: ${left.join(', ')}` : null
    return { seq, forecast: leanForecast(forecast), summary: summarizeForecast(forecast), error: note }
  } catch (error) {
    return { seq, forecast: null, summary: null, error: error instanceof Error ? error.message : String(error) }
  }
}

export const runLiveRules = (
  doc: ChipDocument,
  processId: string | null | undefined,
  lab?: LiveLab | null,
): Finding[] => checkDesignRules(doc, resolveProcess(processId, lab?.processes))

// ── Patches ──────────────────────────────────────────────────────────────────────────────────────────────────
// The editor changes a document by copying only what an edit touches (shared/editor): every other element and
// every untouched list is the same object as before. So what changed is found by identity, element by element,
// and only that crosses to the worker: moving one nozzle of a 4,096-nozzle chip sends three elements (the nozzle
// and its two attached channels), not the 2.5 MB document the page would otherwise copy on every edit.

const LISTS = ['layers', 'ports', 'components', 'channels', 'marks', 'operatingPoints'] as const
type ListName = (typeof LISTS)[number]
type ListPatch = { length: number; set: Array<[number, unknown]> } | { all: unknown[] | undefined }

/** The document's top-level fields but its lists (name, outline, active operating point, …), and per list what changed. */
export interface DocPatch {
  top: Record<string, unknown>
  lists: Partial<Record<ListName, ListPatch>>
  keys: string[]
}

/** Above this share of changed elements a list is sent whole (an insertion at the front shifts every index). */
const WHOLE_LIST_SHARE = 0.5

export function diffDocument(before: ChipDocument, after: ChipDocument): DocPatch {
  const top: Record<string, unknown> = {}
  for (const [k, v] of Object.entries(after)) if (!(LISTS as readonly string[]).includes(k)) top[k] = v
  const lists: DocPatch['lists'] = {}
  for (const name of LISTS) {
    const a = (before as Record<string, unknown>)[name] as unknown[] | undefined
    const b = (after as Record<string, unknown>)[name] as unknown[] | undefined
    if (a === b) continue
    if (!a || !b) {
      lists[name] = { all: b }
      continue
    }
    const set: Array<[number, unknown]> = []
    for (let i = 0; i < b.length; i++) if (a[i] !== b[i]) set.push([i, b[i]])
    if (set.length === 0 && a.length === b.length) continue // a new list of the same elements (a re-check copies every list)
    lists[name] = set.length > WHOLE_LIST_SHARE * b.length ? { all: b } : { length: b.length, set }
  }
  return { top, lists, keys: Object.keys(after) }
}

/** The document `diffDocument(before, after)` was taken to: `before` with the patch applied (before is not changed). */
export function applyPatch(before: ChipDocument, patch: DocPatch): ChipDocument {
  const out: Record<string, unknown> = {}
  for (const key of patch.keys) {
    // the new document's keys in its order
    if (!(LISTS as readonly string[]).includes(key)) {
      out[key] = patch.top[key]
      continue
    }
    const p = patch.lists[key as ListName]
    const old = (before as Record<string, unknown>)[key] as unknown[] | undefined
    if (!p) {
      out[key] = old
      continue
    }
    if ('all' in p) {
      out[key] = p.all
      continue
    }
    const list = old!.slice(0, p.length)
    list.length = p.length
    for (const [i, v] of p.set) list[i] = v
    out[key] = list
  }
  return out as unknown as ChipDocument
}

/**
 * True when the forecast cannot differ between the two documents of a patch: only the alignment marks or the chip
 * outline changed, which the forecast never reads (shared/physics/document reads layers, ports, components,
 * channels, operating points and the name).
 */
export function forecastUnchanged(before: ChipDocument, patch: DocPatch): boolean {
  const changed = Object.keys(patch.lists)
  if (changed.some(n => n !== 'marks')) return false
  const keys = new Set(
    [...Object.keys(before), ...Object.keys(patch.top)].filter(
      k => !(LISTS as readonly string[]).includes(k) && k !== 'outline',
    ),
  )
  for (const k of keys)
    if (JSON.stringify((before as Record<string, unknown>)[k]) !== JSON.stringify(patch.top[k])) return false
  return true
}
