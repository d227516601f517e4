import { requireSession } from '../../utils/access'

export default defineEventHandler(event => requireSession(event).memberships)
