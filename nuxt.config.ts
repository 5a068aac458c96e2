import { fileURLToPath } from 'node:url'
// Rimecase Nuxt configuration. Versions are pinned for Node 20 (see README "Stack").
export default defineNuxtConfig({
  compatibilityDate: '2026-07-01',
  devtools: { enabled: false },
  telemetry: false,
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils', '@vite-pwa/nuxt', 'nuxt-security'],
  css: [
    '@fontsource/atkinson-hyperlegible-next/400.css',
    '@fontsource/atkinson-hyperlegible-next/700.css',
    '@fontsource/atkinson-hyperlegible-mono/400.css',
    '@fontsource/atkinson-hyperlegible-mono/700.css',
  ],
  tailwindcss: { viewer: false, cssPath: '~/assets/css/tailwind.css' },
  app: {
    head: {
      htmlAttrs: { lang: 'en' },
      title: 'Rimecase',
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1, viewport-fit=cover' },
        { name: 'description', content: 'Rimecase: guided fault-finding for ultra-low-temperature refrigeration' },
      ],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  runtimeConfig: {
    databaseUrl: '',
    uploadDir: '.data/uploads',
    uploadDriver: 'fs',
    s3: { accessKeyId: '', secretAccessKey: '', endpoint: '', bucket: '', region: '' },
    smtp: { host: '127.0.0.1', port: 2525, from: 'Rimecase <reports@rimecase.local>', outboxDir: '.data/outbox' },
    testRoutes: false,
    // The address people reach the site at (NUXT_SITE_URL), e.g. https://rimecase.example.org: an https address makes the session cookie Secure, and its origin may send writes.
    siteUrl: '',
    // The cookie is HttpOnly and SameSite=Lax; it is Secure when NUXT_SITE_URL is an https address
    // (server/plugins/sessions.ts) or NUXT_SESSION_COOKIE_SECURE=true.
    session: { cookie: { secure: false, sameSite: 'lax', httpOnly: true }, maxAge: 60 * 60 * 12 },
  },
  nitro: {
    // One worker per core: the diagnosis is CPU work, and a technician's request should not queue
    // behind another's. Per-worker caches are short-lived; e-mails are claimed atomically.
    preset: 'node-cluster',
    experimental: { tasks: false },
    // Serve pre-compressed JS/CSS: technicians load the case page over weak phone connections.
    compressPublicAssets: { gzip: true, brotli: true },
  },
  // An offline app shell: the service worker keeps the app's scripts, styles and fonts, and the last
  // copy of each page and case read, so a case opened before the signal went loads again after a
  // reload without a connection (changes made meanwhile wait in the browser's storage, see
  // app/stores/caseDrafts.ts). Pages and data are always asked of the network first: a cached copy
  // is used only when the network does not answer, so nobody works on a stale build or record.
  pwa: {
    registerType: 'autoUpdate',
    manifest: {
      name: 'Rimecase',
      short_name: 'Rimecase',
      description: 'Guided fault-finding and case records for ultra-low-temperature refrigeration',
      theme_color: '#0e7490',
      background_color: '#f8fafc',
      display: 'standalone',
      start_url: '/',
      icons: [{ src: '/favicon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' }],
    },
    workbox: {
      // Server-rendered pages: no single fallback page stands in for all of them.
      navigateFallback: null,
      globPatterns: ['_nuxt/**/*.{js,css}', '*.svg'],
      cleanupOutdatedCaches: true,
      clientsClaim: true,
      skipWaiting: true,
      runtimeCaching: [
        {
          // Pages: read as visited, or fetched ahead for the open cases (marked by a header).
          urlPattern: ({ request, url }) => request.method === 'GET' && !url.pathname.startsWith('/api/')
            && (request.mode === 'navigate' || request.headers.get('x-rimecase-offline') === 'page'),
          handler: 'NetworkFirst',
          options: { cacheName: 'rimecase-pages', networkTimeoutSeconds: 5, expiration: { maxEntries: 80 } },
        },
        {
          // Data the case pages read; writes are never cached.
          urlPattern: ({ request, url }) => request.method === 'GET'
            && /^\/api\/(cases|units|people|diagnosis\/(tests|titles|vocabulary)|auth\/me|_auth\/session)(\/|$)/.test(url.pathname)
            && !url.pathname.endsWith('.pdf'),
          handler: 'NetworkFirst',
          options: { cacheName: 'rimecase-data', networkTimeoutSeconds: 5, expiration: { maxEntries: 300 } },
        },
        {
          urlPattern: ({ request, url }) => request.method === 'GET' && (request.destination === 'font' || /^\/api\/uploads\/\d+/.test(url.pathname)),
          handler: 'CacheFirst',
          options: { cacheName: 'rimecase-files', expiration: { maxEntries: 200, maxAgeSeconds: 60 * 60 * 24 * 30 } },
        },
      ],
    },
    client: { installPrompt: true },
    devOptions: { enabled: false },
  },
  // Response headers and the content security policy (nuxt-security). Pages get a fresh nonce per
  // request on every script tag Nuxt writes; scripts those load are trusted through 'strict-dynamic',
  // nothing inline or from another origin runs. Styles allow inline (Vue style bindings, chart sizes).
  // Images may be data: or blob: (photo previews before upload); the service worker is our own.
  // API answers carry a policy of their own (server/plugins/api-headers.ts). Our own body limits,
  // rate limits (in PostgreSQL), content-type and Origin checks stay in the route guard, so the
  // module's overlapping middlewares are off.
  security: {
    nonce: true,
    sri: false,
    removeLoggers: false,
    headers: {
      contentSecurityPolicy: {
        'default-src': ["'self'"],
        'base-uri': ["'none'"],
        'script-src': ["'self'", "'strict-dynamic'", "'nonce-{{nonce}}'"],
        'script-src-attr': ["'none'"],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'worker-src': ["'self'"],
        'manifest-src': ["'self'"],
        'media-src': ["'self'", 'blob:'],
        'object-src': ["'none'"],
        'frame-src': ["'self'"],
        'frame-ancestors': ["'none'"],
        'form-action': ["'self'"],
        // Served on loopback over http by npm start; an https site upgrades nothing it does not already use.
        'upgrade-insecure-requests': false,
      },
      xFrameOptions: 'DENY',
      xContentTypeOptions: 'nosniff',
      referrerPolicy: 'strict-origin-when-cross-origin',
      crossOriginOpenerPolicy: 'same-origin',
      crossOriginResourcePolicy: 'same-origin',
      crossOriginEmbedderPolicy: 'credentialless',
      // Photos come through the file picker (which may open the camera app); nothing reads devices directly.
      permissionsPolicy: { camera: [], microphone: [], geolocation: [], 'display-capture': [], fullscreen: [] },
    },
    hidePoweredBy: true,
    requestSizeLimiter: false,
    rateLimiter: false,
    xssValidator: false,
    corsHandler: false,
    allowedMethodsRestricter: false,
    csrf: false,
  },
  hooks: {
    // The browser's zod comes through app/lib/zod-jitless.ts, which turns off zod's eval probe before
    // any schema is built (the content security policy refuses eval).
    'vite:extendConfig'(config, { isClient }) {
      // Component tests (vitest) run without the policy and set their own aliases afterwards: left alone.
      if (!isClient || process.env.VITEST) return
      const mutable = config as { resolve?: { alias?: unknown } }
      const resolve = (mutable.resolve ??= {})
      const zodJitless = { find: /^zod$/, replacement: fileURLToPath(new URL('./app/lib/zod-jitless.ts', import.meta.url)) }
      const alias = resolve.alias
      resolve.alias = Array.isArray(alias) ? [zodJitless, ...alias] : [zodJitless, ...Object.entries(alias ?? {}).map(([find, replacement]) => ({ find, replacement }))]
    },
  },
  typescript: { strict: true },
})
