// Re-forecast a saved revision with the lab's current library: the stored summary is never changed (revisions are
// immutable); the answer shows both and what differs, so a library edit is visible before anyone saves again.
import { createError } from 'h3'
import { junctionName, nameOfId } from '#shared/format/fieldLabels'
import type { RevisionSummary } from '#shared/types/designs'
import type { ForecastDifference, ReforecastAnswer } from '#shared/types/libraries'
import type { LabCaller } from '../utils/access'
import { summarizeWithLibrary } from './libraries'
import { getRevision } from './revisions'

const close = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b))

/** What differs between two summaries of one document: library values, drop sizes, pressures, findings. */
export function summaryDifferences(
  stored: RevisionSummary,
  current: RevisionSummary,
  doc?: Record<string, unknown>,
): ForecastDifference[] {
  const out: ForecastDifference[] = []
  const num = (what: string, a: number | null | undefined, b: number | null | undefined, unit: string) => {
    const x = a ?? null
    const y = b ?? null
    if (x === null && y === null) return
    if (x !== null && y !== null && close(x, y)) return
    out.push({ what, stored: x, current: y, unit })
  }
  const s = stored.library
  const c = current.library
  num('Continuous-phase viscosity', s?.continuous?.viscosityMPaS, c?.continuous?.viscosityMPaS, 'mPa·s')
  num('Continuous-phase density', s?.continuous?.densityKgPerM3, c?.continuous?.densityKgPerM3, 'kg/m³')
  num('Dispersed-phase viscosity', s?.dispersed?.viscosityMPaS, c?.dispersed?.viscosityMPaS, 'mPa·s')
  num('Dispersed-phase density', s?.dispersed?.densityKgPerM3, c?.dispersed?.densityKgPerM3, 'kg/m³')
  num('Interfacial tension', s?.interfacialTension?.mNPerM, c?.interfacialTension?.mNPerM, 'mN/m')
  for (const key of new Set([...Object.keys(s?.process.values ?? {}), ...Object.keys(c?.process.values ?? {})])) {
    const a = s?.process.values[key]
    const b = c?.process.values[key]
    if (typeof a === 'number' || typeof b === 'number')
      num(
        `Process rule ${key}`,
        typeof a === 'number' ? a : null,
        typeof b === 'number' ? b : null,
        key.endsWith('Mbar') ? 'mbar' : /To/.test(key) ? '(ratio)' : 'µm',
      )
  }
  const ids = new Set([...stored.junctions.map(j => j.id), ...current.junctions.map(j => j.id)])
  for (const id of ids) {
    const a = stored.junctions.find(j => j.id === id)
    const b = current.junctions.find(j => j.id === id)
    num(`Droplet diameter at ${junctionName(doc, id)}`, a?.dropletDiameterUm, b?.dropletDiameterUm, 'µm')
    num(`Drop frequency at ${junctionName(doc, id)}`, a?.frequencyHz, b?.frequencyHz, 'Hz')
  }
  for (const port of new Set([...stored.inlets.map(i => i.portId), ...current.inlets.map(i => i.portId)])) {
    num(
      `Inlet pressure at ${nameOfId(doc, port)}`,
      stored.inlets.find(i => i.portId === port)?.pressureMbar,
      current.inlets.find(i => i.portId === port)?.pressureMbar,
      'mbar',
    )
  }
  num('Rule errors', stored.findings.errors, current.findings.errors, '')
  num('Rule warnings', stored.findings.warnings, current.findings.warnings, '')
  if ((stored.forecastError ?? '') !== (current.forecastError ?? ''))
    out.push({ what: 'Forecast problem', stored: stored.forecastError, current: current.forecastError, unit: '' })
  return out
}

export async function reforecastRevision(caller: LabCaller, revisionId: string): Promise<ReforecastAnswer> {
  const revision = await getRevision(caller, revisionId)
  if (revision.summary.pending)
    throw createError({
      statusCode: 409,
      statusMessage: 'Conflict',
      message: "This revision's forecast and rule check are still being computed: try again when they are ready",
    })
  const current = await summarizeWithLibrary(revision.document as never, revision.summary.processId, caller.lab.labId)
  return {
    revisionId,
    stored: revision.summary,
    current,
    differences: summaryDifferences(revision.summary, current, revision.document as Record<string, unknown>),
  }
}
