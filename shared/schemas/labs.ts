import { z } from 'zod'
import { ROLES } from '../utils/roles'

export const labParams = z.object({ labId: z.uuid('Lab id must be a UUID') })
export const memberParams = labParams.extend({ userId: z.uuid('Member id must be a UUID') })
export const memberRoleUpdate = z.object({ role: z.enum(ROLES) })
export type MemberRoleUpdate = z.infer<typeof memberRoleUpdate>
