// A bare Nuxt app (one page, no modules), built from the project's node_modules: the yardstick for how much
// JavaScript the briefing page loads up front. Built by scripts/bench-http.sh into .data/bench/bare.
import { fileURLToPath } from 'node:url'
import { defineNuxtConfig } from 'nuxt/config'

const out = fileURLToPath(new URL('../../../.data/bench/bare', import.meta.url))

export default defineNuxtConfig({
  devtools: { enabled: false },
  buildDir: `${out}/.nuxt`,
  compatibilityDate: '2026-01-01',
  nitro: { output: { dir: `${out}/.output` } },
  telemetry: false,
})
