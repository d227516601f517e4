import { usePool } from './db'

const PROBE_MS = 2000

/** 'ok' when PostgreSQL answers `select 1` within 2 s; 'unreachable' or 'slow' otherwise. */
export async function databaseHealth(): Promise<'ok' | 'unreachable' | 'slow'> {
  let timer: NodeJS.Timeout | undefined
  const slow = new Promise<'slow'>(resolve => {
    timer = setTimeout(() => resolve('slow'), PROBE_MS)
  })
  const probe = usePool()
    .query('select 1')
    .then(
      () => 'ok' as const,
      () => 'unreachable' as const,
    )
  try {
    return await Promise.race([probe, slow])
  } finally {
    clearTimeout(timer)
  }
}
