import { benchRunParams } from '#shared/schemas/bench'
import { getBenchRun, requireBenchCaller } from '../../../../../services/bench'
import { validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, runId } = validParams(event, benchRunParams)
  const caller = requireBenchCaller(event, labId)
  return getBenchRun(caller, runId)
})
