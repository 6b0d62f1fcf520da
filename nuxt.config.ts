// Veerline: Nuxt 4 with the source at the project root (no app/ folder).

/**
 * Components whose code the briefing page loads after its first screen, not up front (see hooks below): the parts
 * further down load when they come into view, the runway card, the offer to acknowledge alerts and the read receipts
 * once the browser is idle after the first paint (lateHydrated in pages/briefings/[code].vue, utils/late-hydration.ts),
 * so a tap on the polar display or on "Mark … read" works by the time one scrolls there. All are rendered on the
 * server as usual.
 */
const LOADED_AFTER_FIRST_SCREEN = ['BriefingChange.vue', 'BriefingOtherEnds.vue', 'BriefingShear.vue',
  'BriefingProfileHeader.vue', 'BriefingConvective.vue', 'TrendChart.vue', 'BriefingRunwayCard.vue', 'BriefingReceipts.vue',
  'BriefingInboxOffer.vue']
export default defineNuxtConfig({
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils', 'nuxt-security', '@nuxt/eslint'],
  devtools: { enabled: false },
  app: {
    head: {
      title: 'Veerline',
      htmlAttrs: { lang: 'en' },
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1' },
        { name: 'description', content: 'Veerline: runway wind components and low-level wind shear briefings' },
        { name: 'theme-color', content: '#0f2a2e' },
      ],
      link: [{ rel: 'icon', type: 'image/svg+xml', href: '/favicon.svg' }],
    },
  },
  css: ['~/assets/css/fonts.css'],
  runtimeConfig: {
    // Filled from NUXT_* environment variables at run time (see README, Configuration).
    // The absolute session limit in seconds (NUXT_SESSION_MAX_AGE): the sealed cookie and the stored session end then.
    session: { maxAge: 7 * 24 * 3600 },
    public: {
      appUrl: 'http://127.0.0.1:3000',
    },
  },
  dir: { app: '.' },
  srcDir: '.',
  // The API answers JSON, never a page: no CSP nonce to make for it (its CSP is default-src 'none', set by
  // server/middleware/01.request-guard.ts).
  routeRules: { '/api/**': { security: { nonce: false } } },
  compatibilityDate: '2026-01-01',
  nitro: {
    // Only the helpers directly in server/utils are auto-imported; the domain modules (server/domain/*) and the
    // pure code (shared/wind, shared/limits) are imported by path, so their many exports do not flood the global names.
    imports: {
      dirsScanOptions: { fileFilter: (file: string) => !/server[/\\]utils[/\\][^/\\]+[/\\]/.test(file) },
    },
  },
  vite: {
    // Fonts are served as files from our own origin: Vite would inline the small subsets as data: URIs, which the
    // CSP's font-src 'self' blocks (tests/browser/security-csp.test.ts caught it).
    build: { assetsInlineLimit: (file: string) => (/\.(woff2?|ttf|otf)$/i.test(file) ? false : undefined) },
  },
  typescript: { strict: true, typeCheck: false },
  telemetry: false,
  hooks: {
    // The briefing page's parts below its first screen (lateHydrated in pages/briefings/[code].vue) are rendered on
    // the server as usual but their code is not preloaded: it loads when the part scrolls into view or the browser is
    // idle. So is a chunk that only such parts import (the polar geometry and display).
    'build:manifest'(manifest) {
      const late = new Set(Object.keys(manifest).filter(k => LOADED_AFTER_FIRST_SCREEN.some(f => manifest[k]!.src?.endsWith(f))))
      for (let grew = true; grew;) {
        grew = false
        for (const [key, chunk] of Object.entries(manifest)) {
          if (late.has(key) || chunk.isEntry || !key.endsWith('.js')) continue
          const importers = Object.keys(manifest).filter(k => manifest[k]!.imports?.includes(key))
          // A page's own chunk is loaded by the router (a dynamic import of the entry): never late.
          const loadedByOthers = Object.keys(manifest).some(k => !late.has(k) && manifest[k]!.dynamicImports?.includes(key))
          if (importers.length && !loadedByOthers && importers.every(k => late.has(k))) {
            late.add(key)
            grew = true
          }
        }
      }
      for (const key of late) manifest[key]!.preload = false
      // The briefing page's own chunk: the late parts import code it shares with them (the preferences store, the
      // unit helpers), so Rollup names no module for it and the manifest lists it as "_<hash>.js". The server render
      // preloads by module, and would then not preload the page's code at all (it would load only after the entry
      // asked for it; it used to come in only as an import of the late parts, which stayed listed). Name it after
      // the page again.
      const PAGE = 'pages/briefings/[code].vue'
      const pageKey = Object.keys(manifest).find(k => !manifest[k]!.src && manifest[k]!.isDynamicEntry
        && manifest[k]!.dynamicImports?.some(d => late.has(d) && manifest[d]!.src?.endsWith('BriefingRunwayCard.vue')))
      if (pageKey && !manifest[PAGE]) {
        manifest[PAGE] = { ...manifest[pageKey]!, src: PAGE }
        Reflect.deleteProperty(manifest, pageKey)
        const rename = (keys?: string[]) => keys?.map(k => (k === pageKey ? PAGE : k))
        for (const chunk of Object.values(manifest)) {
          chunk.imports = rename(chunk.imports)
          chunk.dynamicImports = rename(chunk.dynamicImports)
        }
      }
    },
    // The API route table for server/middleware/api-methods.ts (405 with Allow for a known path and a method it lacks).
    'nitro:init'(nitro) {
      // Both the scanned route files and the handlers modules add (nuxt-auth-utils' /api/_auth/session).
      nitro.options.virtual['#veerline/api-routes'] = () => `export default ${JSON.stringify([...nitro.scannedHandlers, ...nitro.options.handlers]
        .filter(h => !h.middleware && h.route?.startsWith('/api/'))
        .map(h => ({ route: h.route, method: h.method ?? null })))}`
    },
  },
  eslint: { config: { stylistic: true } },
  // nuxt-security 2.5.1: the headers and the CSP with a per-response nonce. Its defaults changed for Veerline: no
  // CORS answer at all (nothing but our own pages calls the API), no HSTS or upgrade-insecure-requests here (both are
  // added at run time only when the public address is https: server/plugins/security.ts), frame-ancestors 'none'
  // and X-Frame-Options DENY, no Cross-Origin-Embedder-Policy, and its rate limiter, request size limiter and XSS
  // filter off: the sign-in lockout, server/middleware/01.request-guard.ts and output escaping do those jobs.
  security: {
    strict: false,
    nonce: true,
    sri: true,
    removeLoggers: false,
    hidePoweredBy: true,
    corsHandler: false,
    rateLimiter: false,
    requestSizeLimiter: false,
    xssValidator: false,
    csrf: false,
    headers: {
      crossOriginEmbedderPolicy: false,
      crossOriginOpenerPolicy: 'same-origin',
      crossOriginResourcePolicy: 'same-origin',
      originAgentCluster: '?1',
      referrerPolicy: 'same-origin',
      strictTransportSecurity: false,
      xContentTypeOptions: 'nosniff',
      xFrameOptions: 'DENY',
      xXSSProtection: '0',
      permissionsPolicy: { 'camera': [], 'display-capture': [], 'geolocation': [], 'microphone': [], 'payment': [], 'usb': [] },
      contentSecurityPolicy: {
        'default-src': ['\'self\''],
        'base-uri': ['\'none\''],
        'connect-src': ['\'self\''],
        'font-src': ['\'self\''],
        'form-action': ['\'self\''],
        'frame-ancestors': ['\'none\''],
        // The mailbox preview is an <iframe srcdoc sandbox="">: no scripts, no same-origin access.
        'frame-src': ['\'self\''],
        'img-src': ['\'self\'', 'data:'],
        'manifest-src': ['\'self\''],
        'media-src': ['\'self\''],
        'object-src': ['\'none\''],
        'script-src': ['\'self\'', '\'strict-dynamic\'', '\'nonce-{{nonce}}\''],
        'script-src-attr': ['\'none\''],
        // Vue writes style attributes (chart positions, bars), which a nonce cannot cover.
        'style-src': ['\'self\'', '\'unsafe-inline\''],
        'worker-src': ['\'self\''],
        'upgrade-insecure-requests': false,
      },
    },
  },
  tailwindcss: { cssPath: '~/assets/css/tailwind.css', viewer: false },
})
