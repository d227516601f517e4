// Bundles the server's worker threads next to the built server (called from Nitro's `compiled` hook).
import { build } from 'esbuild'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('..', import.meta.url))

export async function buildWorkers(serverDir) {
  await build({
    entryPoints: {
      geometry: join(root, 'server/workers/geometry.ts'),
      imaging: join(root, 'server/workers/imaging.ts'),
    },
    outdir: join(serverDir, 'workers'),
    outExtension: { '.js': '.mjs' },
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    logLevel: 'warning',
    // Native or large packages stay outside the bundle; they resolve from .output/server/node_modules, where Nitro
    // has traced them because the server imports them too.
    external: ['sharp', '@aws-sdk/*', 'file-type', 'busboy'],
    // `#shared/...` (the server's imports of shared code) resolves through the tsconfig paths Nuxt writes.
    tsconfig: join(root, 'tsconfig.json'),
    // some bundled CommonJS packages call require(); give the ES module one
    banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
  })
}
