// The window of one junction of a chip document: the inlets of each phase are set along that phase's axis
// (flows split evenly across a phase's inlets, or one pressure for all of them) and the whole chip is forecast
// at every point through the network (shared/physics/document), so a pressure-driven chip's window comes from
// the same solve the editor shows.
import type { ChipDocument, OperatingPoint } from '../../schemas/chip'
import { forecastDocument, type DocumentForecastOptions } from '../document'
import { ForecastInputError } from '../errors'
import { UNIT } from '../units'
import { linSpace, logSpace } from './grid'
import { pointFromForecast } from './junctionScan'
import type { AxisMode, PlanTarget, Scan, ScanPoint, WindowAxis } from './types'

type Phase = 'continuous' | 'dispersed'

/** Inlet settings as a lab writes them: six significant figures (no 0.0999999999 µL/min from the log grid). */
const sixFigures = (v: number) => Number(v.toPrecision(6))

/** The inlets of each phase at the operating point, and how that phase is driven (its first inlet's mode). */
export function phaseInlets(doc: ChipDocument, op: OperatingPoint): Record<Phase, { ports: string[]; mode: AxisMode }> {
  const phaseOf = new Map(doc.ports.map(p => [p.id, p.feed?.phase]))
  const of = (phase: Phase) => {
    const settings = op.inlets.filter(s => phaseOf.get(s.portId) === phase)
    return { ports: settings.map(s => s.portId), mode: (settings[0]?.mode ?? 'flow') as AxisMode }
  }
  return { continuous: of('continuous'), dispersed: of('dispersed') }
}

/** The operating point with each phase's inlets set to `values` (SI: m³/s total per phase, or Pa each). */
export function withInlets(
  op: OperatingPoint,
  inlets: ReturnType<typeof phaseInlets>,
  values: Record<Phase, number>,
): OperatingPoint {
  const phaseOfPort = new Map<string, Phase>()
  for (const phase of ['continuous', 'dispersed'] as const)
    for (const port of inlets[phase].ports) phaseOfPort.set(port, phase)
  return {
    ...op,
    inlets: op.inlets.map(s => {
      const phase = phaseOfPort.get(s.portId)
      if (!phase) return s
      const { mode, ports } = inlets[phase]
      return mode === 'pressure'
        ? { portId: s.portId, mode: 'pressure', value: sixFigures(values[phase] / 100), unit: 'mbar' }
        : { portId: s.portId, mode: 'flow', value: sixFigures((values[phase] / ports.length) * 6e10), unit: 'uL/min' }
    }),
  }
}

export function withOperatingPoint(doc: ChipDocument, op: OperatingPoint): ChipDocument {
  return {
    ...doc,
    operatingPoints: doc.operatingPoints.map(o => (o.id === op.id ? op : o)),
    activeOperatingPoint: op.id,
  }
}

export interface DocumentScanInput {
  doc: ChipDocument
  op: OperatingPoint
  junctionId: string
  box: Partial<Record<'continuous' | 'dispersed' | 'continuousPressure' | 'dispersedPressure', [number, number]>>
  n: number
  target: PlanTarget
  options: DocumentForecastOptions
}

/** Default search box (common practice, no source): 0.1–100 µL/min per phase, 10 mbar to the lowest pressure limit (else 2 bar). */
export function defaultBox(mode: AxisMode, limit: number | undefined): [number, number] {
  return mode === 'flow' ? [1e-10 / 60, 1e-7 / 60] : [1000, Math.max(2000, limit ?? 200_000)]
}

/** The two axes of a document's window and the point at any pair of axis values. */
export function documentEvaluator(input: DocumentScanInput) {
  const { doc, op, junctionId, n, target, options } = input
  const inlets = phaseInlets(doc, op)
  for (const phase of ['continuous', 'dispersed'] as const) {
    if (!inlets[phase].ports.length) {
      throw new ForecastInputError([
        {
          path: 'document.operatingPoints',
          message: `Operating point "${op.id}" sets no ${phase} inlet: mark an inlet's feed as ${phase} and give it a setting`,
        },
      ])
    }
  }
  const limit = Math.min(options.limits?.bondPressure ?? Infinity, options.limits?.pumpPressure ?? Infinity)
  const axis = (phase: Phase): WindowAxis => {
    const mode = inlets[phase].mode
    const box =
      (mode === 'flow' ? input.box[phase] : input.box[`${phase}Pressure`]) ??
      defaultBox(mode, Number.isFinite(limit) ? limit : undefined)
    return {
      phase,
      mode,
      unit: mode === 'flow' ? UNIT.flow : UNIT.pressure,
      values: mode === 'flow' ? logSpace(box[0], box[1], n) : linSpace(box[0], box[1], n),
    }
  }
  const continuous = axis('continuous')
  const dispersed = axis('dispersed')
  const settingsAt = (xc: number, xd: number) => withInlets(op, inlets, { continuous: xc, dispersed: xd })
  const at = (xc: number, xd: number, i = 0, k = 0): ScanPoint => {
    const answer = forecastDocument(withOperatingPoint(doc, settingsAt(xc, xd)), op.id, options)
    const junction = answer.junctions.find(j => j.id === junctionId)
    const margins = answer.network.margins
    const withinLimits = !margins || Object.values(margins).every(m => m === undefined || m.ok)
    const inletPressure = Math.max(0, ...answer.network.inlets.map(s => s.pressure.value))
    const where: Pick<ScanPoint, 'i' | 'j' | 'xc' | 'xd' | 'qc' | 'qd' | 'pc' | 'pd'> = {
      i,
      j: k,
      xc,
      xd,
      qc: 0,
      qd: 0,
    }
    if (continuous.mode === 'pressure') where.pc = xc
    if (dispersed.mode === 'pressure') where.pd = xd
    const f = junction?.forecast
    if (!f) {
      const flowOf = (phase: Phase) =>
        answer.network.inlets
          .filter(s => inlets[phase].ports.includes(s.port))
          .reduce((sum, s) => sum + s.flow.value, 0)
      return {
        ...where,
        qc: flowOf('continuous'),
        qd: flowOf('dispersed'),
        diameter: null,
        frequency: null,
        regime: 'none',
        valid: false,
        withinLimits,
        inletPressure,
        hit: false,
        why: answer.warnings.find(w => w.element === junction?.element)?.code ?? 'no-droplets',
      }
    }
    where.qc = f.inputs.flow.continuous.value
    where.qd = f.inputs.flow.dispersed.value
    return { ...pointFromForecast(f, target, where, withinLimits), inletPressure }
  }
  return { continuous, dispersed, at, settingsAt }
}

export function scanDocument(input: DocumentScanInput): Scan {
  const { continuous, dispersed, at } = documentEvaluator(input)
  const points: ScanPoint[] = []
  for (let i = 0; i < input.n; i++)
    for (let k = 0; k < input.n; k++) points.push(at(continuous.values[i]!, dispersed.values[k]!, i, k))
  return { continuous, dispersed, points, junctionId: input.junctionId }
}
