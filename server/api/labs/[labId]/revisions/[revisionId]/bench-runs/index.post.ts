import { benchRunCreate, benchRunCsvQuery } from '#shared/schemas/bench'
import { revisionParams } from '#shared/schemas/designs'
import { createBenchRun, requireBenchCaller } from '../../../../../../services/bench'
import { readLimitedBody } from '../../../../../../utils/bodyLimit'
import { parseOr400, validBody, validParams, validQuery } from '../../../../../../utils/validate'

// JSON (a typed run, or { source: "csv", csv }), or a text/csv body with the column and unit in the query.
export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireBenchCaller(event, labId, 'measurements:record')
  const isCsv = (getRequestHeader(event, 'content-type') ?? '').toLowerCase().startsWith('text/csv')
  let body
  if (isCsv) {
    const query = validQuery(event, benchRunCsvQuery)
    const raw = await readLimitedBody(event)
    const { column, unit, header, ...rest } = query
    body = parseOr400(
      benchRunCreate,
      {
        ...rest,
        source: 'csv',
        csv: { text: new TextDecoder().decode(raw ?? new Uint8Array()), column, unit, header },
      },
      'Body',
    )
  } else {
    body = await validBody(event, benchRunCreate)
  }
  setResponseStatus(event, 201)
  return createBenchRun(caller, revisionId, body)
})
