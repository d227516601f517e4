import { micrographParams, micrographUpdate } from '#shared/schemas/bench'
import { requireBenchCaller } from '../../../../../../../services/bench'
import { excludeDetections } from '../../../../../../../services/benchMicrographs'
import { validBody, validParams } from '../../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, runId, micrographId } = validParams(event, micrographParams)
  const caller = requireBenchCaller(event, labId, 'measurements:record')
  const { excluded } = await validBody(event, micrographUpdate)
  return excludeDetections(caller, runId, micrographId, excluded)
})
