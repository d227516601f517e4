import { benchRunParams } from '#shared/schemas/bench'
import { requireBenchCaller } from '../../../../../../services/bench'
import { uploadMicrograph } from '../../../../../../services/benchMicrographs'
import { withUploadFile } from '../../../../../../utils/multipart'
import { validParams } from '../../../../../../utils/validate'

// multipart/form-data: "image" (PNG, JPEG or TIFF, checked on its bytes) and the scale ("umPerPx", or "barPx" + "barUm"),
// parsed and checked in the imaging process (server/services/micrographWork.ts).
export default defineEventHandler(async event => {
  const { labId, runId } = validParams(event, benchRunParams)
  const caller = requireBenchCaller(event, labId, 'measurements:record')
  const result = await withUploadFile(event, upload => uploadMicrograph(caller, runId, upload))
  // 201 with the drops when measured in time; 202 while the background job still measures (follow the micrograph).
  setResponseStatus(event, result.pending ? 202 : 201)
  return result
})
