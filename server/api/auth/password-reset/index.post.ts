// Public: ask for a reset link. The answer is the same whether or not an account has the address.
import { passwordResetRequest } from '#shared/schemas/auth'
import { requestPasswordReset } from '../../../services/passwords'
import { appOrigin } from '../../../utils/origin'
import { validBody } from '../../../utils/validate'

export default defineEventHandler(async event => {
  const body = await validBody(event, passwordResetRequest)
  return requestPasswordReset(body, appOrigin(event))
})
