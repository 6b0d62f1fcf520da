import { defineConfig } from 'vitest/config'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('.', import.meta.url))

// One run, three suites. Files run one after another: the API and browser suites share one server and database,
// and some of them stop and start MariaDB.
export default defineConfig({
  resolve: { alias: { '#shared': `${root}shared`, '~~': root } },
  test: {
    fileParallelism: false,
    reporters: ['default'],
    projects: [
      { extends: true, test: { name: 'unit', include: ['tests/unit/**/*.test.ts'] } },
      { extends: true, test: { name: 'api', include: ['tests/api/**/*.test.ts'], testTimeout: 30_000, hookTimeout: 60_000 } },
      { extends: true, test: { name: 'browser', include: ['tests/browser/**/*.test.ts'], testTimeout: 60_000, hookTimeout: 60_000 } },
    ],
  },
})
