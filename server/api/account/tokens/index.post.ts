import { tokenCreate } from '#shared/schemas/tokens'
import { createToken } from '../../../services/apiTokens'
import { requireSession } from '../../../utils/access'
import { validBody } from '../../../utils/validate'

export default defineEventHandler(async event => {
  const session = requireSession(event)
  const body = await validBody(event, tokenCreate)
  setResponseStatus(event, 201)
  return createToken(session, body)
})
