import { asBuiltParams } from '#shared/schemas/asBuilt'
import { attachAsBuiltFile } from '../../../../../../../services/asBuiltFiles'
import { requireLabPermission } from '../../../../../../../utils/access'
import { readFileForm } from '../../../../../../../utils/multipart'
import { validParams } from '../../../../../../../utils/validate'

// multipart/form-data with one file field "file": a profilometer CSV or a PNG, JPEG or TIFF photo (checked on its bytes).
export default defineEventHandler(async event => {
  const { labId, revisionId, asBuiltId } = validParams(event, asBuiltParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  const file = await readFileForm(
    event,
    'file',
    'Send the file as multipart/form-data in a field "file": a profilometer CSV or a PNG, JPEG or TIFF photo',
  )
  setResponseStatus(event, 201)
  return attachAsBuiltFile(caller, revisionId, asBuiltId, file)
})
