import { designListQuery } from '#shared/schemas/designs'
import { labParams } from '#shared/schemas/labs'
import { listDesigns } from '../../../../services/designs'
import { requireLabPermission } from '../../../../utils/access'
import { validParams, validQuery } from '../../../../utils/validate'

// One page of the list as the body (an array of rows, as before paging); the total and the page in headers.
export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'designs:view')
  const { rows, total, page, pageSize } = await listDesigns(caller, validQuery(event, designListQuery))
  setResponseHeaders(event, { 'X-Total-Count': String(total), 'X-Page': String(page), 'X-Page-Size': String(pageSize) })
  return rows
})
