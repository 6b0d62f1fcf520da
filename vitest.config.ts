import { defineConfig } from 'vitest/config'
import { defineVitestProject } from '@nuxt/test-utils/config'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('.', import.meta.url))

// One run, four suites. Files run one after another: the API and browser suites share one server and database,
// and some of them stop and start MariaDB. The component suite mounts Vue components in a Nuxt environment
// (happy-dom) with the app's own auto-imports, plugins and Pinia; it needs no server.
export default defineConfig({
  resolve: { alias: { '#shared': `${root}shared`, '~~': root } },
  test: {
    fileParallelism: false,
    reporters: ['default'],
    projects: [
      { extends: true, test: { name: 'unit', include: ['tests/unit/**/*.test.ts'] } },
      await defineVitestProject({
        test: {
          name: 'component',
          include: ['tests/component/**/*.test.ts'],
          environment: 'nuxt',
          environmentOptions: { nuxt: { domEnvironment: 'happy-dom' } },
          // Starting the Nuxt environment takes a few seconds per file on a busy 2-core machine.
          hookTimeout: 60_000,
          testTimeout: 30_000,
        },
      }),
      { extends: true, test: { name: 'api', include: ['tests/api/**/*.test.ts'], testTimeout: 30_000, hookTimeout: 60_000 } },
      { extends: true, test: { name: 'browser', include: ['tests/browser/**/*.test.ts'], testTimeout: 180_000, hookTimeout: 60_000 } },
    ],
  },
})
