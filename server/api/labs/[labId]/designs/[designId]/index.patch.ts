import { designParams, designUpdate } from '#shared/schemas/designs'
import { updateDesign } from '../../../../../services/designs'
import { requireLabPermission } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, designId } = validParams(event, designParams)
  const caller = requireLabPermission(event, labId, 'designs:edit')
  return updateDesign(caller, designId, await validBody(event, designUpdate))
})
