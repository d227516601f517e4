// Dropwright — Nuxt configuration. The repository root is the source folder (no app/ folder).
export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  srcDir: '.',
  devtools: { enabled: false },
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', '@sidebase/nuxt-auth'],
  css: ['~/assets/css/fonts.css', '~/assets/css/main.css'],
  app: { head: { title: 'Dropwright', htmlAttrs: { lang: 'en' } } },
  runtimeConfig: {
    databaseUrl: '', // NUXT_DATABASE_URL or DATABASE_URL
    sessionTtlHours: 24 * 7,
  },
  auth: {
    isEnabled: true,
    originEnvKey: 'AUTH_ORIGIN',
    baseURL: '/api/auth',
    globalAppMiddleware: false,
    provider: {
      type: 'local',
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
  experimental: { scanPageMeta: true, extraPageMetaExtractionKeys: ['auth'] },
  typescript: { strict: true },
  nitro: { experimental: { tasks: false } },
})
