import { fileURLToPath } from 'node:url'
import vue from '@vitejs/plugin-vue'
import { defineConfig } from 'vitest/config'

// Three layers, each with what it promises:
//   unit    — pure code (shared/, geometry/, components) in Node or happy-dom; fast, no services.
//   api     — the built server on a free port against the real PostgreSQL test database.
//   browser — playwright-core driving Debian's chromium against the built server.
const root = fileURLToPath(new URL('.', import.meta.url))
const alias = {
  '#shared': `${root}shared`,
  '~~': root.replace(/\/$/, ''),
  '~': root.replace(/\/$/, ''),
  '@': root.replace(/\/$/, ''),
}

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          exclude: ['tests/unit/components/**'],
          environment: 'node',
        },
      },
      {
        // Vue components mounted with @vue/test-utils in happy-dom.
        plugins: [vue()],
        resolve: { alias },
        test: { name: 'components', include: ['tests/unit/components/**/*.test.ts'], environment: 'happy-dom' },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          globalSetup: ['tests/support/server.setup.ts'],
          testTimeout: 30_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'browser',
          include: ['tests/browser/**/*.test.ts'],
          globalSetup: ['tests/support/server.setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
})
