// Public (the token is the credential): whose password the reset link sets, and until when.
import { passwordResetParams } from '#shared/schemas/auth'
import { describePasswordReset } from '../../../services/passwords'
import { validParams } from '../../../utils/validate'

export default defineEventHandler(async event => {
  const { token } = validParams(event, passwordResetParams)
  return describePasswordReset(token)
})
