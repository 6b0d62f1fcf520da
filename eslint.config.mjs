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
  // Galera rules (DEVELOPERS.md, "Transactions and Galera"): every transaction goes through transaction() of
  // server/utils/db.ts, which retries certification conflicts (1213) and lock wait timeouts (1205); and no GET_LOCK,
  // which is local to one node.
  files: ['server/**/*.ts', 'scripts/**/*.ts'],
  ignores: ['server/utils/db.ts'],
  rules: {
    'no-restricted-syntax': ['error', {
      selector: 'CallExpression[callee.type=\'MemberExpression\'][callee.property.name=\'transaction\']',
      message: 'Open transactions with transaction(work) from server/utils/db.ts: it retries 1213 (Galera certification conflicts) and 1205.',
    }, {
      selector: 'Literal[value=/GET_LOCK|RELEASE_LOCK/i], TemplateElement[value.raw=/GET_LOCK|RELEASE_LOCK/i]',
      message: 'GET_LOCK is local to one Galera node: take turns through a row that certification decides (see scripts/db-setup.ts).',
    }],
  },
}, {
  // Tests and the fault suite read loosely typed JSON answers from the real server.
  files: ['tests/**', 'scripts/ha/**'],
  rules: { '@typescript-eslint/no-explicit-any': 'off' },
})
