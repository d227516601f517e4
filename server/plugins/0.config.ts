// Reads and validates the configuration (server/utils/config.ts) before anything else starts: a wrong environment
// variable stops the server here, with a message naming it, instead of failing later inside a request.
import { useConfig } from '../utils/config'

export default defineNitroPlugin(() => {
  useConfig()
})
