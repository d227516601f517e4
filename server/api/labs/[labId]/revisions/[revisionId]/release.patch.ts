import { revisionParams } from '#shared/schemas/designs'
import { fabStatusBody } from '#shared/schemas/review'
import { setFabStatus } from '../../../../../services/releases'
import { requireLabPermission } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

export default defineEventHandler(async (event) => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'fabrication:report')
  const { fabStatus, note } = await validBody(event, fabStatusBody)
  return setFabStatus(caller, revisionId, fabStatus, note)
})
