import { defineConfig } from 'vitest/config';

// One config for the web view (vite build/preview) and the tests (vitest run).
export default defineConfig({
  root: 'src/app',
  publicDir: false,
  build: { outDir: '../../dist/app', emptyOutDir: true },
  preview: { host: '127.0.0.1' },
  test: {
    root: '.',
    include: ['test/**/*.test.ts'],
    testTimeout: 60_000,
    pool: 'threads',
  },
});
