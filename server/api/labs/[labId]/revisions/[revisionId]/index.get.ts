import { revisionParams } from '#shared/schemas/designs'
import { revisionJson } from '../../../../../services/revisionJson'
import { requireLabPermission } from '../../../../../utils/access'
import { validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  setResponseHeader(event, 'content-type', 'application/json; charset=utf-8')
  return revisionJson(caller, revisionId)
})
