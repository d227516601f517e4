// The forecast core as it ships: bundled by esbuild the way scripts/build-workers.mjs bundles the server's
// geometry worker (and Vite/Rollup the editor's worker), without the tsx loader's `keepNames` wrappers, which
// re-name every closure at each creation: measured here on the 512-nozzle chip, 28 ms under tsx against 20 ms bundled.
import { build } from 'esbuild'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { pathToFileURL } from 'node:url'

const root = join(import.meta.dirname, '..', '..')

/** Imports `entry` (a path from the repository root) from a fresh esbuild bundle; the bundle is deleted after. */
export async function importShipped<T>(entry: string): Promise<T> {
  const dir = mkdtempSync(join(tmpdir(), 'dropwright-bench-'))
  try {
    const outfile = join(dir, 'core.mjs')
    await build({
      entryPoints: [join(root, entry)],
      outfile,
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      logLevel: 'warning',
      tsconfig: join(root, 'tsconfig.json'),
    })
    return (await import(pathToFileURL(outfile).href)) as T
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}
