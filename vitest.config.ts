import { fileURLToPath } from 'node:url'
import { defineVitestProject } from '@nuxt/test-utils/config'
import { defineConfig } from 'vitest/config'

const alias = {
  '#shared': fileURLToPath(new URL('./shared', import.meta.url)),
  '#server': fileURLToPath(new URL('./server', import.meta.url)),
  // Pure helpers under app/utils are unit-tested in plain Node too.
  '~': fileURLToPath(new URL('./app', import.meta.url)),
}

// Three projects: `unit` runs pure modules in plain Node; `nuxt` mounts components and composables
// in the Nuxt runtime (happy-dom) with endpoints faked; `api` drives the built server over HTTP
// against a real PostgreSQL started by scripts/test.mjs (RIMECASE_TEST_BASE_URL).
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      { resolve: { alias }, test: { name: 'unit', include: ['tests/unit/**/*.{test,spec}.ts'], environment: 'node' } },
      await defineVitestProject({
        test: { name: 'nuxt', include: ['tests/nuxt/**/*.{test,spec}.ts'], environment: 'nuxt', testTimeout: 30_000, hookTimeout: 120_000 },
      }),
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.{test,spec}.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
})
