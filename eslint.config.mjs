// @ts-check
import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt({
  ignores: ['migrations/**', '.data/**', 'test-results/**'],
}, {
  rules: {
    'vue/multi-word-component-names': 'off',
  },
}, {
  // No import circles in the server and the pure code (import-x's no-cycle; the plugin is registered as `import`).
  files: ['server/**/*.ts', 'shared/**/*.ts'],
  settings: { 'import-x/extensions': ['.ts', '.js', '.mjs'], 'import-x/resolver': { node: { extensions: ['.ts', '.js', '.mjs'] } } },
  rules: { 'import/no-cycle': ['error', { ignoreExternal: true }] },
}, {
  // The schema is the bottom layer: nothing under server/db imports from the server's helpers, domain or seed.
  files: ['server/db/**/*.ts'],
  rules: {
    'no-restricted-imports': ['error', { patterns: [
      { group: ['../utils', '../utils/*', '../../utils', '../../utils/*', '../domain', '../domain/*', '../../domain', '../../domain/*', '../seed', '../seed/*', '../../seed', '../../seed/*', '~~/server/*', '#imports'], message: 'server/db is the bottom layer: it must not import from server/utils, server/domain or server/seed' },
    ] }],
  },
}, {
  // Tests read loosely typed JSON answers from the real server.
  files: ['tests/**'],
  rules: { '@typescript-eslint/no-explicit-any': 'off' },
})
