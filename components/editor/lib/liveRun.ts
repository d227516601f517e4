// One live-forecast run, the same in the worker and (where there is no worker) on the main thread.
import type { ChipDocument } from '#shared/schemas/chip'
import { forecastDocument, summarizeForecast, type DocumentForecast, type ForecastSummary } from '#shared/physics/document'
import { mergeLibrary, type LabLiquidsData, type LiquidLibrary } from '#shared/physics/liquids'

/** `warm`: run the document a few times to let the engine compile the forecast code, answer nothing. */
/** `lab`: the lab's own liquids and pairs (plain data), merged with the built-in library for this run. */
export interface LiveRequest { seq: number; doc: ChipDocument; warm?: boolean; lab?: LabLiquidsData | null }
export interface LiveAnswer { seq: number; forecast: DocumentForecast | null; summary: ForecastSummary | null; error: string | null }

/** The forecast with the network's node and channel lists left empty (kept: inlets, outlets, uniformity, margins). */
export function leanForecast(f: DocumentForecast): DocumentForecast {
  return { ...f, network: { ...f.network, nodes: [], channels: [] } }
}

let merged: { lab: string; library: LiquidLibrary } | undefined
/** The merged library, rebuilt only when the lab's data changes. */
function libraryFor(lab: LabLiquidsData | null | undefined): LiquidLibrary | undefined {
  if (!lab) return undefined
  const key = JSON.stringify(lab)
  if (merged?.lab !== key) merged = { lab: key, library: mergeLibrary(lab) }
  return merged.library
}

export function runLiveForecast(doc: ChipDocument, seq: number, lab?: LabLiquidsData | null): LiveAnswer {
  try {
    const library = libraryFor(lab)
    const forecast = forecastDocument(doc, undefined, library ? { library } : {})
    // Parts and channels not wired yet are left out by the forecast itself, with a warning naming each.
    const left = forecast.warnings.filter(w => w.code === 'component-unconnected' || w.code === 'channels-unconnected').map(w => (w as { element?: string }).element)
    const note = left.length ? `Not yet connected, so not forecast: ${left.join(', ')}` : null
    return { seq, forecast: leanForecast(forecast), summary: summarizeForecast(forecast), error: note }
  } catch (error) {
    return { seq, forecast: null, summary: null, error: error instanceof Error ? error.message : String(error) }
  }
}
