import { dxfQuery, revisionParams } from '../../../../../../shared/schemas/designs'
import { revisionDxf } from '../../../../../services/mask'
import { getRevision } from '../../../../../services/revisions'
import { requireLabPermission } from '../../../../../utils/access'
import { validParams, validQuery } from '../../../../../utils/validate'

export default defineEventHandler(async (event) => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  const query = validQuery(event, dxfQuery)
  const { dxf, filename } = revisionDxf(await getRevision(caller, revisionId, { open: true }), {
    mirror: query.mirror === 'true', layers: query.layers?.split(',').map(s => s.trim()).filter(Boolean),
  })
  setResponseHeaders(event, { 'content-type': 'application/dxf; charset=utf-8', 'content-disposition': `attachment; filename="${filename}"` })
  return dxf
})
