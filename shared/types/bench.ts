// Answers of the bench-results API, as the client reads them.
import type { DetectedDrop } from '../imaging/measure'
import type { SampleSummary } from '../physics/calibration/stats'
import type { LabCalibration } from '../physics/calibration/lab'

export interface BenchPrediction {
  junctionId: string
  kind: string
  diameterUm: number
  regime: string
  method: string
  valid: boolean
  flowRatio: number
  forecastFlowRatio: number
  atBenchFlows: boolean
  mainWidthUm: number
  depthUm: number
  uncertainty: number
  uncertaintySource: string
  /** The chip the forecast ran on (absent on runs recorded before as-built chips were used). */
  chip?: { basis: 'as-built' | 'as-drawn'; asBuiltId: string | null; reportedAt: string | null; benchSizes: boolean }
}

export interface BenchMicrographInfo {
  id: string
  runId: string
  fileName: string
  contentType: string
  bytes: number
  width: number
  height: number
  umPerPx: number
  status: 'queued' | 'measuring' | 'done' | 'failed'
  progress: number
  error: string | null
  excluded: number[]
  detected: number
  summary: SampleSummary | null
  createdAt: string
}

export interface BenchRunInfo {
  id: string
  revisionId: string
  designId: string
  operatingPointId: string | null
  junctionId: string | null
  conditions: Record<string, unknown>
  asBuilt: Record<string, unknown> | null
  quantity: 'diameter' | 'plug-length'
  source: 'typed' | 'csv' | 'micrograph'
  count: number
  meanUm: number | null
  sdUm: number | null
  cv: number | null
  frequencyHz: number | null
  predicted: BenchPrediction | null
  relativeError: number | null
  notes: string
  ranBy: string
  ranByName: string | null
  ranAt: string
  micrographs: BenchMicrographInfo[]
}

export interface BenchRunList {
  revision: { id: string; designId: string; number: number; status: string }
  /** The latest as-built report of the revision: new runs forecast on it unless told "as drawn". */
  asBuilt: {
    id: string
    reportedAt: string
    recordedByName: string
    depths: { layerId: string; depthUm: number }[]
    widths: { elementId: string; widthUm: number }[]
  } | null
  runs: BenchRunInfo[]
}

export interface MicrographResult {
  micrograph: BenchMicrographInfo
  drops: DetectedDrop[]
  summary: SampleSummary | null
  method: string | null
}

export interface CalibrationAnswer {
  calibrations: LabCalibration[]
  design: null | {
    id: string
    mode: 'model' | 'lab-calibrated'
    changedAt: string | null
    latestRevisionId: string | null
    junctions: {
      junctionId: string
      kind: string
      modelDiameterUm: number
      calibrated: { value: number; interval95: [number, number] } | null
    }[]
  }
}
