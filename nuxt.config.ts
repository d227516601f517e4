// Dropwright — Nuxt configuration. The repository root is the source folder (no app/ folder).
import { fileURLToPath } from 'node:url'
import { DEFAULT_SESSION_TTL_HOURS } from './server/utils/config'
import { PAGE_CSP, PERMISSIONS_POLICY } from './server/utils/securityHeaders'

export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  srcDir: '.',
  devtools: { enabled: false },
  // Only .vue files are components: the pure helpers beside them (components/*/lib/*.ts) are plain modules.
  components: [{ path: '~/components', extensions: ['vue'] }],
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', '@sidebase/nuxt-auth', 'nuxt-security'],
  css: [
    '@fontsource/ibm-plex-sans/400.css',
    '@fontsource/ibm-plex-sans/500.css',
    '@fontsource/ibm-plex-sans/600.css',
    '@fontsource/jetbrains-mono/400.css',
    '@fontsource/jetbrains-mono/500.css',
    '~/assets/css/main.css',
  ],
  app: {
    head: {
      title: 'Dropwright',
      htmlAttrs: { lang: 'en' },
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
      // Security: the page CSP has no 'unsafe-eval', so zod must not compile validators in the browser (its probe
      // for `new Function` would be a CSP violation). Its global config has to be set before any schema is built.
      script: [
        {
          innerHTML:
            'globalThis.__zod_globalConfig = Object.assign(globalThis.__zod_globalConfig || {}, { jitless: true })',
          tagPriority: 'critical',
        },
      ],
    },
  },
  // The server's settings are environment variables read once by server/utils/config.ts (README, "Configuration").
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
        // Only until the first answer: the server sets the marker with the session's own expiry (server/utils/cookies.ts).
        maxAgeInSeconds: DEFAULT_SESSION_TTL_HOURS * 3600,
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
      config.errorHandler = [
        fileURLToPath(new URL('./server/errors/database.ts', import.meta.url)),
        ...[config.errorHandler ?? []].flat(),
      ]
    },
  },
  // Security headers (docs/api-limits.md). nuxt-security writes them on every answer and the page CSP with a fresh
  // script nonce per answer; /api answers get their own set in server/middleware/0.request-guard.ts. Its other
  // defences are off: CSRF (Origin check), body types and counted body limits are ours (server/utils/bodyLimit.ts,
  // origin.ts), sign-in throttling lives in PostgreSQL, and its XSS filter would reject comments that quote HTML.
  security: {
    headers: {
      contentSecurityPolicy: PAGE_CSP,
      crossOriginEmbedderPolicy: false,
      crossOriginOpenerPolicy: 'same-origin',
      crossOriginResourcePolicy: 'same-origin',
      // Not no-referrer: with it, browsers send `Origin: null` on the app's own writes, which the CSRF check refuses.
      referrerPolicy: 'same-origin',
      strictTransportSecurity: { maxAge: 15552000, includeSubdomains: false },
      xFrameOptions: 'DENY',
      permissionsPolicy: PERMISSIONS_POLICY,
    },
    nonce: true,
    sri: true,
    requestSizeLimiter: false,
    rateLimiter: false,
    xssValidator: false,
    corsHandler: false,
    allowedMethodsRestricter: false,
    removeLoggers: false,
    csrf: false,
    basicAuth: false,
    hidePoweredBy: true,
  },
  experimental: { scanPageMeta: true, extraPageMetaExtractionKeys: ['auth'] },
  typescript: { strict: true },
  tailwindcss: { cssPath: false, configPath: 'tailwind.config.ts' },
  nitro: {
    experimental: { tasks: false },
    // Worker threads (server/workers) are bundled beside the built server once Nitro has compiled it.
    hooks: {
      async compiled(nitro) {
        await (await import('./scripts/build-workers.mjs')).buildWorkers(nitro.options.output.serverDir)
      },
    },
  },
})
