// @ts-check
import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt({
  ignores: ['migrations/**', '.data/**', 'test-results/**'],
}, {
  rules: {
    'vue/multi-word-component-names': 'off',
  },
}, {
  // Tests read loosely typed JSON answers from the real server.
  files: ['tests/**'],
  rules: { '@typescript-eslint/no-explicit-any': 'off' },
})
