import { micrographParams } from '#shared/schemas/bench'
import { requireBenchCaller } from '../../../../../../../services/bench'
import { getMicrograph } from '../../../../../../../services/benchMicrographs'
import { validParams } from '../../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, runId, micrographId } = validParams(event, micrographParams)
  const caller = requireBenchCaller(event, labId)
  return getMicrograph(caller, runId, micrographId)
})
