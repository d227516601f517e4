import { designParams } from '#shared/schemas/designs'
import { listRevisions } from '../../../../../../services/revisions'
import { requireLabPermission } from '../../../../../../utils/access'
import { validParams } from '../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, designId } = validParams(event, designParams)
  const caller = requireLabPermission(event, labId, 'designs:view')
  return listRevisions(caller, designId)
})
