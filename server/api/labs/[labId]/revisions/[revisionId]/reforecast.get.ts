import { revisionParams } from '#shared/schemas/designs'
import { reforecastRevision } from '../../../../../services/librariesReforecast'
import { requireLabPermission } from '../../../../../utils/access'
import { validParams } from '../../../../../utils/validate'

// The revision forecast again with the lab's current library, beside the stored forecast (which never changes).
export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'designs:view')
  return reforecastRevision(caller, revisionId)
})
