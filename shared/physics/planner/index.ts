// The planner: from a target droplet (size, rate, loading) to an operating window, a recommended point, a
// geometry per junction kind and what the run will yield. See docs/planner.md.
import { findProcessIn, processesWith, type LabProcessData } from '../../../geometry/rules/processes'
import type { FabricationProcess } from '../../../geometry/rules/types'
import { parseChipDocument, type ChipDocument } from '../../schemas/chip'
import {
  planDocumentRequest,
  planJunctionRequest,
  PLAN_LIMITS,
  type PlanDocumentRequest,
  type PlanJunctionRequest,
} from '../../schemas/plan'
import type { JunctionRequest } from '../../schemas/forecast'
import { forecastDocument, type DocumentForecastOptions } from '../document'
import { mergeLibrary, type LabLiquidsData } from '../liquids'
import { chooseOperatingPoint, resolveOperatingPoint } from '../document/operating-point'
import { documentPath } from '../document/paths'
import { ForecastInputError } from '../errors'
import { parseOrThrow } from '../forecast/issues'
import { resolveJunctionRequest } from '../forecast/junctionRequest'
import type { JunctionKind } from '../junction/regime'
import type { Warning } from '../quantity'
import { digitalAssay } from './digital'
import { documentEvaluator, scanDocument } from './documentScan'
import { suggestGeometries, type Liquids } from './geometry'
import { forecastAt, pointFromForecast, scanJunction } from './junctionScan'
import { encapsulation } from './poisson'
import { runPlan as planRun } from './runPlan'
import type { PlanAnswer, PlanTarget, Recommended, Scan, ScanPoint } from './types'
import { buildWindow, recommend, targetQuantities, type Evaluate } from './window'

export type { PlanAnswer, PlanWindow, Recommended, WindowPoint, Scan, ScanPoint, PlanTarget } from './types'
export type { GeometrySuggestion } from './geometry'
export type { Encapsulation } from './poisson'
export type { DigitalAssay } from './digital'
export type { RunPlan } from './runPlan'
export { windowCsv } from './csv'
export { scanJunction } from './junctionScan'
export { scanDocument } from './documentScan'

/** Default flow search of one phase: 0.1–100 µL/min (the issue's example range). */
const DEFAULT_FLOWS: [number, number] = [1e-10 / 60, 1e-7 / 60]

type Questions = Pick<
  PlanJunctionRequest,
  'target' | 'search' | 'limits' | 'process' | 'encapsulation' | 'digital' | 'run'
>

function planTarget(t: Questions['target']): PlanTarget {
  const diameter = t.dropletDiameter ?? Math.cbrt((6 * t.dropletVolume!) / Math.PI)
  const target: PlanTarget = { diameter, volume: (Math.PI / 6) * diameter ** 3, tolerance: t.tolerance }
  if (t.minFrequency !== undefined) target.minFrequency = t.minFrequency
  return target
}

/**
 * What the caller brings besides the request: its lab's own liquids, pairs and processes (plain data, as
 * GET /api/v1/liquids?lab= gives them), when a lab was named; null or absent → the built-in library only.
 */
export interface PlanContext {
  lab?: (LabLiquidsData & { processes: readonly LabProcessData[] }) | null
}

/**
 * The process the plan checks against: the one named, among the built-in processes and the caller's lab's (never
 * another lab's: the caller passes its own); the first built-in one when none is named.
 */
function processOf(id: string | undefined, context: PlanContext): FabricationProcess {
  const known = processesWith(context.lab?.processes ?? [])
  if (!id) return known[0]!
  const found = findProcessIn(id, context.lab?.processes ?? [])
  if (found) return found
  const hint = context.lab
    ? ''
    : " (a lab's own process needs its lab: POST /api/v1/plan?lab=<lab id>, or npm run plan -- --process-file=<file>)"
  throw new ForecastInputError([
    {
      path: 'process',
      message: `"${id}" is not a fabrication process here${hint}: use one of ${known.map(p => `"${p.id}"`).join(', ')}`,
    },
  ])
}

/** The parts every plan shares once the window is scanned. */
function finish(
  q: Questions,
  process: FabricationProcess,
  target: PlanTarget,
  scan: Scan,
  evaluate: Evaluate,
  liquids: Liquids | null,
  kinds: JunctionKind[],
  limitsChecked: boolean,
  warnings: Warning[],
): { answer: PlanAnswer; picked: ScanPoint | undefined } {
  const { recommended, unreachable, point: picked } = recommend(scan, target, evaluate, limitsChecked)
  const answer: PlanAnswer = {
    target: targetQuantities(target),
    window: buildWindow(scan, target),
    recommended,
    geometry: liquids ? suggestGeometries(liquids, target, process, kinds) : [],
    warnings,
  }
  if (unreachable) answer.unreachable = unreachable
  const d = recommended?.dropletDiameter
  const volume = d ? (Math.PI / 6) * d.value ** 3 : target.volume
  const frequency = recommended?.frequency?.value
  const valid = Boolean(recommended?.valid)
  if (!recommended)
    warnings.push({
      code: 'no-recommended-point',
      message:
        'No point reaches the target, so loading and digital statistics use the target volume and no run plan is made',
    })
  if (q.encapsulation)
    answer.encapsulation = encapsulation(
      q.encapsulation.concentration,
      volume,
      frequency,
      q.encapsulation.targetLambda,
      d ? valid : true,
    )
  if (q.digital) answer.digital = digitalAssay(q.digital.partitions, volume, q.digital.positives, q.digital.confidence)
  if (q.run && recommended?.frequency) {
    answer.run = planRun(
      {
        qc: recommended.flow.continuous.value,
        qd: recommended.flow.dispersed.value,
        frequency: recommended.frequency.value,
        valid,
      },
      q.run,
    )
  }
  return { answer, picked }
}

function planJunction(input: unknown, context: PlanContext): PlanAnswer {
  const request = parseOrThrow(planJunctionRequest, input)
  const process = processOf(request.process, context)
  const library = context.lab ? mergeLibrary(context.lab) : undefined
  const { junction, warnings } = resolveJunctionRequest(
    { ...request, flow: { continuous: 1e-12, dispersed: 1e-12 } } as JunctionRequest,
    library,
  )
  const target = planTarget(request.target)
  const n = request.search?.points ?? PLAN_LIMITS.pointsPerAxis.junction
  const scan = scanJunction(
    junction,
    { continuous: request.search?.continuous ?? DEFAULT_FLOWS, dispersed: request.search?.dispersed ?? DEFAULT_FLOWS },
    n,
    target,
  )
  const evaluate: Evaluate = (qc, qd) =>
    pointFromForecast(forecastAt(junction, qc, qd), target, { i: 0, j: 0, xc: qc, xd: qd, qc, qd })
  const {
    flowContinuous: _c,
    flowDispersed: _d,
    kind: _k,
    mainWidth: _w,
    inletWidth: _i,
    depth: _h,
    ...liquids
  } = junction
  if (request.limits)
    warnings.push({
      code: 'limits-not-checked',
      message:
        'A single junction has no network, so the pump and bond limits are not checked: plan a chip document to check them',
    })
  return finish(request, process, target, scan, evaluate, liquids, ['t-junction', 'flow-focusing', 'step'], false, [
    ...warnings,
  ]).answer
}

function parseDocument(request: PlanDocumentRequest): ChipDocument {
  if (request.document === undefined)
    throw new ForecastInputError([
      { path: 'document', message: 'required field is missing: give the chip document (JSON) under "document"' },
    ])
  const parsed = parseChipDocument(request.document)
  if (!parsed.ok)
    throw new ForecastInputError(parsed.errors.map(e => ({ path: documentPath(e.path), message: e.message })))
  return parsed.document
}

function planDocument(input: unknown, context: PlanContext): PlanAnswer {
  const request = parseOrThrow(planDocumentRequest, input)
  const process = processOf(request.process, context)
  const doc = parseDocument(request)
  const { point: op } = chooseOperatingPoint(doc, request.operatingPoint)
  const library = context.lab ? mergeLibrary(context.lab) : undefined
  const options: DocumentForecastOptions = library ? { limits: {}, library } : { limits: {} }
  const bond = request.limits?.bondPressure ?? (request.process ? process.bondPressureLimitMbar * 100 : undefined)
  if (bond !== undefined) options.limits!.bondPressure = bond
  if (request.limits?.pumpPressure !== undefined) options.limits!.pumpPressure = request.limits.pumpPressure
  const first = forecastDocument(doc, op.id, options)
  const ids = first.junctions.map(j => `"${j.id}"`).join(', ')
  if (!first.junctions.length)
    throw new ForecastInputError([
      {
        path: 'document.components',
        message: `Design "${doc.name}" has no connected junction to plan: place a T-junction, flow-focusing cross or step nozzle and wire it to the inlets`,
      },
    ])
  // A junction id, or the component it belongs to (its first nozzle for a step array).
  const wanted = request.junctionId ?? first.junctions[0]!.id
  const junction = first.junctions.find(j => j.id === wanted) ?? first.junctions.find(j => j.element === wanted)
  if (!junction)
    throw new ForecastInputError([
      { path: 'junctionId', message: `Junction "${wanted}" is not in design "${doc.name}": use one of ${ids}` },
    ])
  const junctionId = junction.id
  const target = planTarget(request.target)
  const scanInput = {
    doc,
    op,
    junctionId,
    target,
    options,
    box: request.search ?? {},
    n: request.search?.points ?? PLAN_LIMITS.pointsPerAxis.document,
  }
  // A chip's scan costs one whole-chip forecast per point: the grid is bounded by the chip's size.
  const channels = Math.max(1, first.network.channels.length)
  const largest = Math.max(
    PLAN_LIMITS.pointsPerAxis.min,
    Math.min(PLAN_LIMITS.pointsPerAxis.chip, Math.floor(Math.sqrt(PLAN_LIMITS.chipWork / channels))),
  )
  if (request.search?.points !== undefined && scanInput.n > largest)
    throw new ForecastInputError([
      {
        path: 'search.points',
        message: `a ${scanInput.n} × ${scanInput.n} grid is too much for a chip of ${channels} channels (each point solves the whole chip): use at most ${largest} points per axis`,
      },
    ])
  scanInput.n = Math.min(scanInput.n, largest)
  const evaluator = documentEvaluator(scanInput)
  if (
    request.search?.points === undefined &&
    (evaluator.continuous.mode === 'pressure' || evaluator.dispersed.mode === 'pressure')
  )
    scanInput.n = Math.min(largest, PLAN_LIMITS.pointsPerAxis.pressure)
  const scan = scanDocument(scanInput)
  const evaluate: Evaluate = (xc, xd) => evaluator.at(xc, xd)
  const resolved = resolveOperatingPoint(doc, op.id, library)
  const warnings: Warning[] = [...resolved.warnings]
  let liquids: Liquids | null = null
  if (resolved.interfacialTension) {
    liquids = {
      continuous: resolved.continuous,
      dispersed: resolved.dispersed,
      interfacialTension: resolved.interfacialTension,
      temperature: resolved.temperature,
    }
    if (resolved.contactAngle !== undefined) liquids.contactAngle = resolved.contactAngle
  } else if (resolved.tensionProblem) warnings.push(resolved.tensionProblem)
  const limitsChecked = Object.keys(options.limits!).length > 0
  const { answer, picked } = finish(
    request,
    process,
    target,
    scan,
    evaluate,
    liquids,
    ['t-junction', 'flow-focusing', 'step'],
    limitsChecked,
    warnings,
  )
  if (answer.recommended && picked) attachSettings(answer.recommended, picked, evaluator.settingsAt, op.id)
  if (evaluator.continuous.mode === 'pressure' || evaluator.dispersed.mode === 'pressure') {
    warnings.push({
      code: 'pressure-caution',
      message:
        "Pressurised chips and tubing can burst and spray: stay below the bond's and the fittings' limits and follow your lab's safety rules",
    })
  }
  return answer
}

/** The inlet settings of the recommended point, from its axis values. */
function attachSettings(
  rec: Recommended,
  point: ScanPoint,
  settingsAt: (xc: number, xd: number) => { inlets: NonNullable<Recommended['inlets']> },
  opId: string,
): void {
  rec.operatingPoint = opId
  rec.inlets = settingsAt(point.xc, point.xd).inlets
}

/**
 * Runs a plan request (parsed JSON): `junction` (a forecast request without flow) or `document`, plus `target`.
 * `context.lab`: the caller's lab's own liquids, pairs and processes, which the request may then name. Throws ForecastInputError
 * whose issues name each bad field; any other error is a bug.
 */
export function runPlan(request: unknown, context: PlanContext = {}): PlanAnswer {
  if (typeof request !== 'object' || request === null || Array.isArray(request)) {
    throw new ForecastInputError([
      { path: '', message: 'the request must be a JSON object with "junction" or "document", and "target"' },
    ])
  }
  const keys = ['junction', 'document'].filter(key => key in request)
  if (keys.length !== 1)
    throw new ForecastInputError([
      {
        path: '',
        message: `give exactly one of "junction" or "document" (got ${keys.length ? keys.join(', ') : 'none'})`,
      },
    ])
  return keys[0] === 'junction' ? planJunction(request, context) : planDocument(request, context)
}
