import { z } from 'zod'
import { safeText } from './text'

export const signInBody = z.object({
  email: safeText(undefined, 'E-mail').trim().toLowerCase().max(254, 'E-mail is at most 254 characters').email('Enter an e-mail address'),
  password: safeText(undefined, 'Password').min(1, 'Enter your password').max(200, 'Password is at most 200 characters'),
})
export type SignInBody = z.infer<typeof signInBody>
