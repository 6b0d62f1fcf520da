// Veerline: Nuxt 4 with the source at the project root (no app/ folder).
export default defineNuxtConfig({
  modules: ['@nuxtjs/tailwindcss', '@pinia/nuxt', 'nuxt-auth-utils', '@nuxt/eslint'],
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
    public: {
      appUrl: 'http://127.0.0.1:3000',
    },
  },
  dir: { app: '.' },
  srcDir: '.',
  compatibilityDate: '2026-01-01',
  nitro: {
    // Only the helpers directly in server/utils are auto-imported; the domain modules (server/domain/*) and the
    // pure code (shared/wind, shared/limits) are imported by path, so their many exports do not flood the global names.
    imports: {
      dirsScanOptions: { fileFilter: (file: string) => !/server[/\\]utils[/\\][^/\\]+[/\\]/.test(file) },
    },
  },
  typescript: { strict: true, typeCheck: false },
  telemetry: false,
  eslint: { config: { stylistic: true } },
  tailwindcss: { cssPath: '~/assets/css/tailwind.css', viewer: false },
})
