// Dropwright — Nuxt configuration. The repository root is the source folder (no app/ folder).
import { fileURLToPath } from 'node:url'

export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  srcDir: '.',
  devtools: { enabled: false },
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', '@sidebase/nuxt-auth'],
  css: [
    '@fontsource/ibm-plex-sans/400.css', '@fontsource/ibm-plex-sans/500.css', '@fontsource/ibm-plex-sans/600.css',
    '@fontsource/jetbrains-mono/400.css', '@fontsource/jetbrains-mono/500.css',
    '~/assets/css/main.css',
  ],
  app: { head: { title: 'Dropwright', htmlAttrs: { lang: 'en' }, link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }] } },
  runtimeConfig: {
    databaseUrl: '', // NUXT_DATABASE_URL or DATABASE_URL
    sessionTtlHours: 24 * 7,
  },
  auth: {
    isEnabled: true,
    originEnvKey: 'AUTH_ORIGIN',
    baseURL: '/api/auth',
    // Every page is guarded unless it opts out (sign-in does); see tests/browser/guard.test.ts.
    globalAppMiddleware: { isEnabled: true, addDefaultCallbackUrl: true },
    provider: {
      type: 'local',
      pages: { login: '/sign-in' },
      endpoints: {
        signIn: { path: '/login', method: 'post' },
        signOut: { path: '/logout', method: 'post' },
        getSession: { path: '/session', method: 'get' },
        signUp: false,
      },
      token: {
        // The real credential is an httpOnly cookie set by the server; the module keeps only a marker.
        signInResponseTokenPointer: '/marker',
        cookieName: 'dw.marker',
        type: '',
        headerName: 'X-Dw-Marker',
        maxAgeInSeconds: 60 * 60 * 24 * 7,
        sameSiteAttribute: 'lax',
        secureCookieAttribute: false,
        httpOnlyCookieAttribute: false,
      },
      session: { dataType: { user: '{ id: string, email: string, name: string }' } },
      refresh: { isEnabled: false },
    },
    sessionRefresh: { enablePeriodically: false, enableOnWindowFocus: false },
  },
  hooks: {
    // Our error handlers run before Nuxt's own (which renders the error page): a database that cannot answer is 503.
    'nitro:config'(config) {
      config.errorHandler = [fileURLToPath(new URL('./server/errors/database.ts', import.meta.url)), ...[config.errorHandler ?? []].flat()]
    },
  },
  experimental: { scanPageMeta: true, extraPageMetaExtractionKeys: ['auth'] },
  typescript: { strict: true },
  tailwindcss: { cssPath: false, configPath: 'tailwind.config.ts' },
  nitro: {
    experimental: { tasks: false },
    // Worker threads (server/workers) are bundled beside the built server once Nitro has compiled it.
    hooks: { async compiled(nitro) { await (await import('./scripts/build-workers.mjs')).buildWorkers(nitro.options.output.serverDir) } },
  },
})
