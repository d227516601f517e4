import type { LabLiquidsData, LiquidListing, PairListing } from '../physics/liquids'
import type { LabProcessData } from '../../geometry/rules/processes'
import type { RevisionSummary } from './designs'

/** GET /api/v1/liquids?lab=…: the built-in library merged with the lab's, and the processes the rules know. */
export interface LabLibraryListing {
  liquids: LiquidListing[]
  pairs: PairListing[]
  surfactants: string[]
  /** The lab's open entries as plain data, for the editor's live forecast and rules (only with ?lab=). */
  labData?: LabLiquidsData & { processes: LabProcessData[] }
  processes?: Array<{
    id: string
    name: string
    origin: 'built-in' | 'lab'
    material: string
    minFeatureUm: number
    bondPressureLimitMbar: number
  }>
}

/** One value that differs between the stored forecast and the one with the current library. */
export interface ForecastDifference {
  what: string
  stored: number | string | null
  current: number | string | null
  unit: string
}
/** GET /api/labs/:labId/revisions/:revisionId/reforecast. */
export interface ReforecastAnswer {
  revisionId: string
  stored: RevisionSummary
  current: RevisionSummary
  differences: ForecastDifference[]
}
