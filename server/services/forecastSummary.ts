// The forecast part of a revision summary. A document the forecast cannot solve still saves: the reason is kept.
import { ForecastInputError } from '#shared/physics/errors'
import { forecastDocument, summarizeForecast } from '#shared/physics/document'
import { resolveOperatingPoint } from '#shared/physics/document/operating-point'
import { BUILT_IN_LIBRARY, type LiquidLibrary, type LiquidProperties } from '#shared/physics/liquids'
import type { ChipDocument } from '#shared/schemas/chip'
import type { LibrarySnapshot, LiquidSnapshot, RevisionSummary } from '#shared/types/designs'

type ForecastPart = Pick<RevisionSummary, 'operatingPoint' | 'junctions' | 'inlets' | 'forecastError'>

export function forecastSummary(doc: ChipDocument, library: LiquidLibrary = BUILT_IN_LIBRARY): ForecastPart {
  try {
    const s = summarizeForecast(forecastDocument(doc, undefined, { library }))
    return { ...s, forecastError: null }
  } catch (error) {
    if (!(error instanceof ForecastInputError) && !(error instanceof Error && error.name === 'NetworkError'))
      console.error('[summary] forecast failed:', error)
    const message =
      error instanceof ForecastInputError
        ? error.issues.map(i => i.message).join('; ')
        : error instanceof Error
          ? error.message
          : String(error)
    return {
      operatingPoint: doc.activeOperatingPoint ?? null,
      junctions: [],
      inlets: [],
      forecastError: `No forecast for this revision: ${message}`,
    }
  }
}

function liquidSnapshot(liquid: LiquidProperties, library: LiquidLibrary): LiquidSnapshot {
  const entry = liquid.id ? library.liquids.find(l => l.id === liquid.id) : undefined
  return {
    id: liquid.id ?? null,
    name: liquid.name,
    origin: entry ? (entry.origin ?? 'built-in') : 'given',
    viscosityMPaS: liquid.viscosity.value * 1e3,
    densityKgPerM3: liquid.density.value,
    source: liquid.viscosity.source,
  }
}

/** The liquids, pair and tension the active operating point resolves to (the process is added by the caller). */
export function liquidSnapshotOf(
  doc: ChipDocument,
  library: LiquidLibrary = BUILT_IN_LIBRARY,
): Omit<LibrarySnapshot, 'process'> {
  try {
    const op = resolveOperatingPoint(doc, undefined, library)
    const t = op.interfacialTension
    return {
      operatingPoint: op.point.id,
      temperatureC: op.point.temperatureC,
      continuous: liquidSnapshot(op.continuous, library),
      dispersed: liquidSnapshot(op.dispersed, library),
      surfactant: op.point.surfactant ?? 'none',
      interfacialTension: t
        ? {
            mNPerM: t.value * 1e3,
            origin: t.method === 'lab-library-pair' ? 'lab' : t.method === 'library-pair' ? 'built-in' : 'given',
            source: t.source,
          }
        : null,
    }
  } catch {
    return {
      operatingPoint: doc.activeOperatingPoint ?? null,
      temperatureC: null,
      continuous: null,
      dispersed: null,
      surfactant: null,
      interfacialTension: null,
    }
  }
}
