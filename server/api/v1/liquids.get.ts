// The built-in library of liquids, pairs and surfactants, each value with its source; with `?lab=<id>` (a lab the
// caller, or the token, belongs to) the lab's own liquids, pairs and processes too, each marked "origin": "lab".
import { liquidsQuery } from '#shared/schemas/libraries'
import { listLiquids } from '#shared/physics/liquids'
import { labLibraryListing } from '../../services/libraries'
import { requireLabPermission, requireSession } from '../../utils/access'
import { validQuery } from '../../utils/validate'

export default defineEventHandler(async event => {
  requireSession(event)
  const { lab } = validQuery(event, liquidsQuery)
  if (!lab) return listLiquids()
  requireLabPermission(event, lab, 'forecast:run')
  return labLibraryListing(lab)
})
