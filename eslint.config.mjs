// ESLint flat config (@nuxt/eslint-config, standalone: no Nuxt module needed). `npm test` runs `npm run lint` first
// and fails on any error. Layout is Prettier's (.prettierrc.json): `npm test` also runs `prettier --check .` (`npm run format` fixes).
import { createConfigForNuxt } from '@nuxt/eslint-config/flat'

// What the pure core may not import, and why (DEVELOPERS.md, "Layers"). Aliases and deep paths are covered too.
const NITRO =
  'The core must stay independent of Nuxt/Nitro: it runs in the browser, in workers and in scripts. Keep request handling in server/.'
const FRAMEWORK = [
  {
    group: ['vue', 'vue/*', '@vue/*', 'vue-router', 'pinia', '@pinia/*'],
    message:
      'The core must stay independent of Vue and Pinia: the browser and the server run the same code. Pass data in from a component or store instead.',
  },
  { group: ['nuxt', 'nuxt/*', 'h3', 'nitropack', 'nitropack/*'], message: NITRO },
  // '#' starts a comment in the gitignore-style `group` patterns, so Nuxt's virtual modules need a regex.
  { regex: '^#(app|imports|internal|build|components)(/|$)', message: NITRO },
  {
    group: ['drizzle-orm', 'drizzle-orm/*', 'pg', 'pg-*', 'pg-boss', '**/server/**', '~~/server/*', '~/server/*'],
    message: 'The core must not touch the database or the server: queries live in server/services.',
  },
  {
    group: ['node:*', 'fs', 'fs/*', 'path', 'os', 'child_process', 'worker_threads', 'crypto', 'url', 'stream', 'util'],
    message: 'The core runs in the browser too: no Node built-ins. Do file and process work in scripts/ or server/.',
  },
  {
    group: ['konva', 'konva/*', 'vue-konva', 'echarts', 'echarts/*'],
    message: 'The core draws nothing: rendering (Konva, ECharts) belongs to components/.',
  },
  {
    group: [
      '~/components/*',
      '~~/components/*',
      '**/components/**',
      '~/stores/*',
      '~~/stores/*',
      '**/stores/**',
      '~/composables/*',
      '**/composables/**',
    ],
    message: 'The core must not reach up into the UI layers.',
  },
]

export default createConfigForNuxt({
  features: { stylistic: false, typescript: true },
  dirs: { src: ['.'] },
})
  .append({
    // The house style allows these (tests reach into answers with `any`, the solvers use comma sequences, ids are
    // deleted from maps, templates cast with `as … | undefined`); layout is Prettier's business, not a lint error.
    name: 'dropwright/house',
    files: ['**/*.ts', '**/*.mts', '**/*.vue'],
    rules: {
      '@typescript-eslint/no-explicit-any': 'off',
      '@typescript-eslint/no-dynamic-delete': 'off',
      '@typescript-eslint/no-unused-expressions': 'off',
      '@typescript-eslint/consistent-type-imports': 'warn',
      'import/no-duplicates': 'warn',
      'no-empty': ['error', { allowEmptyCatch: true }],
      'vue/no-deprecated-filter': 'off', // misreads `as number | undefined` in templates
      'vue/require-default-prop': 'off', // optional props are undefined on purpose
      'vue/first-attribute-linebreak': 'off',
      // Prettier owns layout; these Vue layout rules contradict what it prints.
      'vue/html-self-closing': 'off',
      'vue/singleline-html-element-content-newline': 'off',
      'vue/multiline-html-element-content-newline': 'off',
      'vue/html-indent': 'off',
      'vue/html-closing-bracket-newline': 'off',
      'vue/max-attributes-per-line': 'off',
    },
  })
  .append({
    name: 'dropwright/ignores',
    ignores: [
      '.nuxt/**',
      '.output/**',
      '.data/**',
      'node_modules/**',
      'test-results/**',
      'server/db/migrations/**',
      'coverage/**',
    ],
  })
  .append({
    name: 'dropwright/pure-core',
    files: ['shared/physics/**', 'geometry/**', 'shared/editor/**', 'shared/schemas/**', 'shared/imaging/**'],
    rules: {
      'no-restricted-imports': ['error', { patterns: FRAMEWORK }],
      // import('…') and require('…') are imports too (the old regex check missed them).
      'no-restricted-syntax': [
        'error',
        {
          selector: 'ImportExpression',
          message: 'No dynamic import() in the core: keep its dependencies visible and static.',
        },
        { selector: 'CallExpression[callee.name="require"]', message: 'No require() in the core.' },
      ],
    },
  })
  .append({
    name: 'dropwright/server-aliases',
    files: ['server/**/*.ts'],
    ignores: ['server/db/**'], // drizzle-kit loads schema.ts on its own, without the aliases
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(\\.\\./)+shared/',
              message:
                'Import shared code as #shared/… (one alias instead of ../../ chains; the worker bundler resolves it too).',
            },
          ],
        },
      ],
    },
  })
