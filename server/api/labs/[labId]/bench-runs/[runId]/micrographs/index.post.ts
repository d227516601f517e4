import { benchRunParams, micrographScale } from '#shared/schemas/bench'
import { requireBenchCaller } from '../../../../../../services/bench'
import { uploadMicrograph } from '../../../../../../services/benchMicrographs'
import { readMicrographForm } from '../../../../../../utils/multipart'
import { parseOr400, validParams } from '../../../../../../utils/validate'

// multipart/form-data: "image" (PNG, JPEG or TIFF, checked on its bytes) and the scale ("umPerPx", or "barPx" + "barUm").
export default defineEventHandler(async event => {
  const { labId, runId } = validParams(event, benchRunParams)
  const caller = requireBenchCaller(event, labId, 'measurements:record')
  const form = await readMicrographForm(event)
  const { umPerPx } = parseOr400(micrographScale, form.fields, 'Scale')
  const result = await uploadMicrograph(caller, runId, form.file, umPerPx)
  // 201 with the drops when measured in time; 202 while the background job still measures (follow the micrograph).
  setResponseStatus(event, result.pending ? 202 : 201)
  return result
})
