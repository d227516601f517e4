import { asBuiltCreate } from '#shared/schemas/asBuilt'
import { revisionParams } from '#shared/schemas/designs'
import { recordAsBuilt } from '../../../../../services/asBuilt'
import { requireLabPermission } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

// The fab (fabrication:report) or the lab on receipt (measurements:record): checked by the service.
export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  const body = await validBody(event, asBuiltCreate)
  setResponseStatus(event, 201)
  return recordAsBuilt(caller, revisionId, body)
})
