import { revisionParams } from '#shared/schemas/designs'
import { listBenchRuns, requireBenchCaller } from '../../../../../../services/bench'
import { validParams } from '../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireBenchCaller(event, labId)
  return listBenchRuns(caller, revisionId)
})
