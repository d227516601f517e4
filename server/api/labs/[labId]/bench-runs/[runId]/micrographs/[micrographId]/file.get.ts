import { micrographFileQuery, micrographParams } from '#shared/schemas/bench'
import { requireBenchCaller } from '../../../../../../../services/bench'
import { micrographFile } from '../../../../../../../services/benchMicrographs'
import { validParams, validQuery } from '../../../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, runId, micrographId } = validParams(event, micrographParams)
  const caller = requireBenchCaller(event, labId)
  const { variant } = validQuery(event, micrographFileQuery)
  const file = await micrographFile(caller, runId, micrographId, variant)
  setResponseHeader(event, 'content-type', file.contentType)
  setResponseHeader(event, 'cache-control', 'private, max-age=3600')
  if (variant === 'original')
    setResponseHeader(
      event,
      'content-disposition',
      `attachment; filename="${file.fileName.replace(/[^\w.-]/g, '_') || 'micrograph'}"`,
    )
  return Buffer.from(file.bytes)
})
