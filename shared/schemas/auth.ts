import { z } from 'zod'

export const signInBody = z.object({
  email: z.string().trim().toLowerCase().max(254, 'E-mail is at most 254 characters').email('Enter an e-mail address'),
  password: z.string().min(1, 'Enter your password').max(200, 'Password is at most 200 characters'),
})
export type SignInBody = z.infer<typeof signInBody>
