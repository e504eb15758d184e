import { defineConfig, type Plugin } from 'vitest/config';

/**
 * The page's Content-Security-Policy, added to the built page only (the dev server injects its own client).
 * Everything comes from the page's own origin: no inline or evaluated script, workers from the same files;
 * figures rasterised to PNG go through blob: images. 'wasm-unsafe-eval' lets the page compile the eigensolver's
 * WebAssembly kernels (assembled in the page from our own source, src/linalg/wasmAssembler.ts); it allows no
 * JavaScript eval.
 */
const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self' 'wasm-unsafe-eval'",
  "worker-src 'self'",
  "style-src 'self'",
  "img-src 'self' data: blob:",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
].join('; ');

function contentSecurityPolicy(): Plugin {
  return {
    name: 'lacuna-content-security-policy',
    apply: 'build',
    transformIndexHtml: () => [{ tag: 'meta', attrs: { 'http-equiv': 'Content-Security-Policy', content: CONTENT_SECURITY_POLICY }, injectTo: 'head-prepend' }],
  };
}

// One config for the web view (vite build/preview) and the tests (vitest run).
export default defineConfig({
  root: 'src/app',
  base: './',
  publicDir: false,
  plugins: [contentSecurityPolicy()],
  worker: { format: 'es' },
  build: { outDir: '../../dist/app', emptyOutDir: true, target: 'es2022' },
  preview: { host: '127.0.0.1' },
  test: {
    root: '.',
    include: ['test/**/*.test.ts'],
    testTimeout: 60_000,
    pool: 'threads',
  },
});
