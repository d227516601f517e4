import { libraryArchiveBody, libraryEntryParams } from '#shared/schemas/libraries'
import { archiveLibraryEntry } from '../../../../../services/libraries'
import { requireLabPermission } from '../../../../../utils/access'
import { validBody, validParams } from '../../../../../utils/validate'

// Archive (or restore) one entry of the lab's library (lab admins): archived entries leave the pickers.
export default defineEventHandler(async event => {
  const { labId, entryId } = validParams(event, libraryEntryParams)
  const caller = requireLabPermission(event, labId, 'libraries:manage')
  const { archived } = await validBody(event, libraryArchiveBody)
  return archiveLibraryEntry(caller, entryId, archived)
})
