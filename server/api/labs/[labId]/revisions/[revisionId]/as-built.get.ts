import { revisionParams } from '#shared/schemas/designs'
import { getAsBuilt } from '../../../../../services/asBuilt'
import { requireLabPermission } from '../../../../../utils/access'
import { validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  return getAsBuilt(caller, revisionId)
})
