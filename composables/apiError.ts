// Maps an API failure to what a person should read, once for the whole client.
export interface ApiProblem {
  status: number
  message: string
  fields: Record<string, string>
}

const BY_STATUS: Record<number, string> = {
  401: 'Your session has ended. Sign in again.',
  403: 'Your role in this lab may not do that.',
  404: 'Not found, or not shared with you.',
  413: 'That is larger than the server accepts.',
  429: 'Too many attempts. Wait a little and try again.',
}

export function toApiProblem(error: unknown): ApiProblem {
  const e = error as {
    statusCode?: number
    status?: number
    data?: { message?: string; data?: { issues?: Array<{ path: string; message: string }> } }
  }
  const status = e?.statusCode ?? e?.status ?? 0
  const fields: Record<string, string> = {}
  for (const issue of e?.data?.data?.issues ?? []) fields[issue.path] = issue.message
  const message = e?.data?.message || BY_STATUS[status] || 'Something went wrong. Nothing was changed; try again.'
  return { status, message, fields }
}
