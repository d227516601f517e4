import { tokenParams } from '#shared/schemas/tokens'
import { revokeToken } from '../../../services/apiTokens'
import { requireSession } from '../../../utils/access'
import { validParams } from '../../../utils/validate'

export default defineEventHandler(event => {
  const session = requireSession(event)
  const { tokenId } = validParams(event, tokenParams)
  return revokeToken(session, tokenId)
})
