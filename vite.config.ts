import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';

const apiPort = Number(process.env.PORT ?? 3000);
const sharedDir = fileURLToPath(new URL('./shared/', import.meta.url));

export default defineConfig({
  plugins: [vue({ features: { optionsAPI: false } })],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  server: {
    port: 5173,
    // Keep the browser's Host header so the API's same-origin check accepts requests from this dev server.
    proxy: { '/api': { target: `http://localhost:${apiPort}`, changeOrigin: false } },
  },
  worker: { format: 'es' },
  build: {
    chunkSizeWarningLimit: 900,
    // Every browser the product supports preloads modules itself; the polyfill would only weigh down the entry.
    modulePreload: { polyfill: false },
    rolldownOptions: {
      // shared/ holds declarations only: no module there runs anything on import that another module relies on.
      // Said so, an import of the engine's index brings only the parts it uses, not the whole engine (the
      // search among them, which the Bench runs in its worker) into every page that reads a schema.
      treeshake: { moduleSideEffects: (id) => (id.startsWith(sharedDir) ? false : undefined) },
      output: {
        codeSplitting: {
          // Only libraries that load together share a chunk. naive-ui is left to the per-page split: one
          // group for it would hand every page the whole component kit.
          groups: [
            { name: 'vendor-flow', test: /node_modules[\\/]@vue-flow/, priority: 1 },
            { name: 'vendor-vue', test: /node_modules[\\/](@vue|vue|vue-router|pinia)[\\/]/, priority: 2 },
          ],
        },
      },
    },
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'engine',
          environment: 'node',
          include: ['tests/engine/**/*.test.ts'],
          setupFiles: ['tests/support/matchers.ts'],
        },
      },
      {
        extends: true,
        test: { name: 'server', environment: 'node', include: ['tests/server/**/*.test.ts'] },
      },
      {
        extends: true,
        test: {
          name: 'client',
          environment: 'happy-dom',
          include: ['tests/client/**/*.test.ts'],
          // First imports of the lazily loaded pages compile naive-ui; on two busy cores that can pass 5 s.
          testTimeout: 20_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'browser',
          environment: 'node',
          include: ['tests/browser/**/*.spec.ts'],
          globalSetup: ['tests/browser/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
