import { revisionParams } from '../../../../../../shared/schemas/designs'
import { getRevision } from '../../../../../services/revisions'
import { requireLabPermission } from '../../../../../utils/access'
import { validParams } from '../../../../../utils/validate'

export default defineEventHandler(async (event) => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  return getRevision(caller, revisionId)
})
