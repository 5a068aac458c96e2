// Rimecase Nuxt configuration. Versions are pinned for Node 20 (see README "Stack").
export default defineNuxtConfig({
  compatibilityDate: '2026-07-01',
  devtools: { enabled: false },
  telemetry: false,
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils'],
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
    session: { cookie: { secure: false }, maxAge: 60 * 60 * 12 },
  },
  nitro: {
    // One worker per core: the diagnosis is CPU work, and a technician's request should not queue
    // behind another's. Per-worker caches are short-lived; e-mails are claimed atomically.
    preset: 'node-cluster',
    experimental: { tasks: false },
    // Serve pre-compressed JS/CSS: technicians load the case page over weak phone connections.
    compressPublicAssets: { gzip: true, brotli: true },
  },
  typescript: { strict: true },
})
