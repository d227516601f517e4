import { listTokens } from '../../../services/apiTokens'
import { requireSession } from '../../../utils/access'

export default defineEventHandler(event => listTokens(requireSession(event)))
