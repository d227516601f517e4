import { dxfQuery, revisionParams } from '#shared/schemas/designs'
import { getRevision } from '../../../../../services/revisions'
import { requireLabPermission } from '../../../../../utils/access'
import { dxfOffThread } from '../../../../../utils/summaryWorker'
import { validParams, validQuery } from '../../../../../utils/validate'

// The mask is made in a geometry worker with a time budget (server/utils/summaryWorker.ts).
export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  const query = validQuery(event, dxfQuery)
  const { dxf, filename } = await dxfOffThread(await getRevision(caller, revisionId, { open: true }), {
    mirror: query.mirror === 'true',
    text: query.text,
    layers: query.layers
      ?.split(',')
      .map(s => s.trim())
      .filter(Boolean),
  })
  setResponseHeaders(event, {
    'content-type': 'application/dxf; charset=utf-8',
    'content-disposition': `attachment; filename="${filename}"`,
  })
  return dxf
})
