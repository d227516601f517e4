import { labParams } from '#shared/schemas/labs'
import { libraryEntryCreateBody } from '#shared/schemas/libraries'
import { createLibraryEntry } from '../../../../services/libraries'
import { requireLabPermission } from '../../../../utils/access'
import { validBody, validParams } from '../../../../utils/validate'

// A new liquid, liquid pair or fabrication process in the lab's library (lab admins).
export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'libraries:manage')
  const body = await validBody(event, libraryEntryCreateBody)
  setResponseStatus(event, 201)
  return createLibraryEntry(caller, body)
})
