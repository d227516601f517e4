// The security headers, written once: nuxt.config.ts gives them to nuxt-security (pages, with a per-answer script
// nonce in the CSP), and server/middleware/0.request-guard.ts puts the API's own set on every /api answer.

/** Browser features the app never uses are off for every document; fullscreen stays for the app's own pages. */
export const PERMISSIONS_POLICY: Record<string, string[]> = {
  accelerometer: [],
  autoplay: [],
  camera: [],
  'display-capture': [],
  'encrypted-media': [],
  fullscreen: ['self'],
  geolocation: [],
  gyroscope: [],
  magnetometer: [],
  microphone: [],
  midi: [],
  payment: [],
  'picture-in-picture': [],
  'publickey-credentials-get': [],
  'screen-wake-lock': [],
  usb: [],
  'xr-spatial-tracking': [],
}

export const permissionsPolicyHeader = () =>
  Object.entries(PERMISSIONS_POLICY)
    .map(([feature, allow]) => `${feature}=(${allow.join(' ')})`)
    .join(', ')

/**
 * Pages: scripts only from our own files or with the answer's nonce (Nuxt's inline config), never an inline script
 * added later, eval or an inline handler; the forecast Web Worker from our own files, styles from our files plus inline style
 * attributes (Vue, Konva and ECharts' SVG set them), fonts and images from our own files (data: for small inlined
 * ones, blob: for exported drawings), nothing may frame a page.
 */
export const PAGE_CSP: Record<string, string[] | boolean> = {
  'default-src': ["'self'"],
  'base-uri': ["'none'"],
  'connect-src': ["'self'"],
  'font-src': ["'self'", 'data:'],
  'form-action': ["'self'"],
  'frame-ancestors': ["'none'"],
  'frame-src': ["'none'"],
  'img-src': ["'self'", 'data:', 'blob:'],
  'manifest-src': ["'self'"],
  'media-src': ["'self'"],
  'object-src': ["'none'"],
  'script-src': ["'self'", "'nonce-{{nonce}}'"],
  'script-src-attr': ["'none'"],
  'style-src': ["'self'", "'unsafe-inline'"],
  'worker-src': ["'self'", 'blob:'],
  'upgrade-insecure-requests': false,
}

/** Every API answer, success or error: JSON that nothing may run, frame, sniff or store. */
export const apiHeaders = (): Record<string, string> => ({
  'cache-control': 'no-store',
  'content-security-policy': "default-src 'none'; frame-ancestors 'none'",
  'permissions-policy': permissionsPolicyHeader(),
  'referrer-policy': 'same-origin',
  'x-content-type-options': 'nosniff',
  'x-frame-options': 'DENY',
})
