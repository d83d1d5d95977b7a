import { defineConfig } from 'vitest/config'
import vue from '@vitejs/plugin-vue'

const apiPort = Number(process.env.PORT ?? 5180)

export default defineConfig({
  plugins: [vue()],
  build: { outDir: 'dist/client', emptyOutDir: true, chunkSizeWarningLimit: 1500 },
  server: { proxy: { '/api': `http://127.0.0.1:${apiPort}` } },
  test: {
    // Each tier runs as its own project so `npm test` can report them separately and a single tier can be run alone.
    projects: [
      { extends: true, test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' } },
      {
        extends: true,
        test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node', testTimeout: 60_000, hookTimeout: 120_000 },
      },
      {
        extends: true,
        test: {
          name: 'e2e', include: ['tests/e2e/**/*.test.ts'], environment: 'node',
          testTimeout: 180_000, hookTimeout: 180_000, fileParallelism: false,
        },
      },
    ],
  },
})
