// The OpenAPI document of the token API, generated from the zod schemas (server/utils/openapi.ts); public.
import { openApiDocument } from '../../utils/openapi'
import { appOrigin } from '../../utils/origin'

let cached: ReturnType<typeof openApiDocument> | undefined

export default defineEventHandler(() => (cached ??= openApiDocument(appOrigin())))
