// The built worker bundles (scripts/build-workers.mjs writes them next to the built server as workers/<name>.mjs).
import { existsSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'

/** `workers/<name>.mjs` in this module's folder or one of its parents; null when the workers are not built. */
export function builtWorkerFile(name: string): string | null {
  let dir = dirname(fileURLToPath(import.meta.url))
  for (let i = 0; i < 5; i++, dir = dirname(dir)) {
    const file = join(dir, 'workers', `${name}.mjs`)
    if (existsSync(file)) return file
  }
  return null
}
