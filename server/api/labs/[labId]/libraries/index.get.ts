import { labParams } from '#shared/schemas/labs'
import { listLibrary } from '../../../../services/libraries'
import { requireLabPermission } from '../../../../utils/access'
import { validParams } from '../../../../utils/validate'

// The lab's own library entries, archived ones included (members who open designs read; admins edit).
export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'designs:view')
  return listLibrary(caller)
})
