import { dxfQuery, revisionParams } from '#shared/schemas/designs'
import { startMaskExport } from '../../../../../../services/maskExports'
import { requireLabPermission } from '../../../../../../utils/access'
import { validParams, validQuery } from '../../../../../../utils/validate'

// The mask DXF of `GET …/dxf` (same query), made by a background job: 202 with the export to poll.
export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  const query = validQuery(event, dxfQuery)
  setResponseStatus(event, 202)
  return startMaskExport(caller, revisionId, query)
})
