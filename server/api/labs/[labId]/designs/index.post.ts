import { designCreate } from '../../../../../shared/schemas/designs'
import { labParams } from '../../../../../shared/schemas/labs'
import { createDesign } from '../../../../services/designs'
import { requireLabPermission } from '../../../../utils/access'
import { assertBodySize } from '../../../../utils/bodyLimit'
import { validBody, validParams } from '../../../../utils/validate'

export default defineEventHandler(async (event) => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'designs:edit')
  assertBodySize(event)
  const body = await validBody(event, designCreate)
  setResponseStatus(event, 201)
  return createDesign(caller, body)
})
