// Errors across a process boundary: a task's outcome as plain data ({ ok, value } or { ok: false, error }), so an
// HTTP error raised in a child process (a 400 naming the field, a 415 for a file that is not an image) reaches the
// request with its status, message and data instead of as a bare "Error".
import { createError } from 'h3'

export interface TaskError {
  statusCode: number
  statusMessage?: string
  message: string
  data?: unknown
}

export type Settled<T> = { ok: true; value: T } | { ok: false; error: TaskError }

/** Runs `work`; an error without a status counts as 500 (so a background job retries it). */
export async function settle<T>(work: () => Promise<T>): Promise<Settled<T>> {
  try {
    return { ok: true, value: await work() }
  } catch (error) {
    const e = error as Partial<TaskError> & { message?: string }
    return {
      ok: false,
      error: {
        statusCode: typeof e.statusCode === 'number' ? e.statusCode : 500,
        ...(e.statusMessage ? { statusMessage: e.statusMessage } : {}),
        message: e.message || String(error),
        ...(e.data !== undefined ? { data: e.data } : {}),
      },
    }
  }
}

/** The value, or the error raised again as an HTTP error. */
export function unsettle<T>(settled: Settled<T>): T {
  if (settled.ok) return settled.value
  throw createError(settled.error)
}
