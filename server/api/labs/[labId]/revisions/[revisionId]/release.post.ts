import { revisionParams } from '#shared/schemas/designs'
import { releaseBody } from '#shared/schemas/orders'
import { releaseRevision } from '../../../../../services/releases'
import { requireLabPermission } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'release:manage')
  const { note, order } = await validBody(event, releaseBody)
  return releaseRevision(caller, revisionId, note, order)
})
