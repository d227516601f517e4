import { designCreate } from '#shared/schemas/designs'
import { labParams } from '#shared/schemas/labs'
import { createDesign } from '../../../../services/designs'
import { requireLabPermission } from '../../../../utils/access'
import { validBody, validParams } from '../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'designs:edit')
  const body = await validBody(event, designCreate)
  setResponseStatus(event, 201)
  return createDesign(caller, body)
})
