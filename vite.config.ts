import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';

const apiPort = Number(process.env.PORT ?? 3000);

export default defineConfig({
  plugins: [vue()],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  server: {
    port: 5173,
    proxy: { '/api': `http://localhost:${apiPort}` },
  },
  worker: { format: 'es' },
  build: {
    chunkSizeWarningLimit: 900,
    rolldownOptions: {
      output: {
        codeSplitting: {
          groups: [
            { name: 'vendor-flow', test: /node_modules[\\/]@vue-flow/ },
            { name: 'vendor-ui', test: /node_modules[\\/](naive-ui|vueuc|vooks|seemly|css-render|@css-render|evtd|treemate|vdirs|date-fns|lodash-es)/ },
            { name: 'vendor-vue', test: /node_modules[\\/](@vue|vue|vue-router|pinia)[\\/]/ },
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
        test: { name: 'client', environment: 'happy-dom', include: ['tests/client/**/*.test.ts'] },
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
