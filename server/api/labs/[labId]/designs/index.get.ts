import { designListQuery } from '#shared/schemas/designs'
import { labParams } from '#shared/schemas/labs'
import { listDesigns } from '../../../../services/designs'
import { requireLabPermission } from '../../../../utils/access'
import { validParams, validQuery } from '../../../../utils/validate'

export default defineEventHandler(async (event) => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'designs:view')
  return listDesigns(caller, validQuery(event, designListQuery))
})
