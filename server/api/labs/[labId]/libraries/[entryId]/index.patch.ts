import { libraryEntryParams, libraryEntryUpdateBody } from '#shared/schemas/libraries'
import { updateLibraryEntry } from '../../../../../services/libraries'
import { requireLabPermission } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

// New values for one entry of the lab's library (lab admins). Saved revisions keep the values they were forecast with.
export default defineEventHandler(async event => {
  const { labId, entryId } = validParams(event, libraryEntryParams)
  const caller = requireLabPermission(event, labId, 'libraries:manage')
  const body = await validBody(event, libraryEntryUpdateBody)
  return updateLibraryEntry(caller, entryId, body)
})
