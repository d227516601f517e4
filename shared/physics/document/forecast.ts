// forecastDocument: an already-parsed chip document at one operating point → network + every junction.
import type { ChipDocument } from '../../schemas/chip'
import { compileDocument } from './compile'
import { forecastJunctions } from './junctions'
import { networkAnswer } from './network'
import { solveTwoPhase } from './twophase'
import { operatingWindows } from './window'
import { resolveOperatingPoint } from './operating-point'
import type { DocumentForecast, DocumentForecastOptions } from './types'

/**
 * Forecasts a parsed chip document at `operatingPointId` (default: the active one, else the only one).
 * Throws ForecastInputError whose issues name the element (`document.channels[3]`) and the fix.
 */
export function forecastDocument(
  doc: ChipDocument,
  operatingPointId?: string,
  options: DocumentForecastOptions = {},
): DocumentForecast {
  const op = resolveOperatingPoint(doc, operatingPointId, options.library)
  const compiled = compileDocument(doc, op)
  const solved = solveTwoPhase(doc, compiled, op, options)
  const network = networkAnswer(compiled, solved, op, options)
  network.operatingWindow = operatingWindows(doc, compiled, solved, op, options)
  const flowScale = Math.max(0, ...solved.solution.sources.map(s => Math.abs(s.flow)))
  const { junctions, warnings } = forecastJunctions(
    compiled.junctions,
    solved.solution.flow,
    op,
    flowScale,
    solved,
    compiled.sources,
    network.operatingWindow,
  )
  return {
    document: { name: doc.name },
    operatingPoint: { id: op.point.id, name: op.point.name },
    network,
    junctions,
    warnings: [...network.warnings, ...warnings],
  }
}
