import { defineConfig } from 'vite';

// The library build: the pure core as one ES module for plain JavaScript (package "exports"), with declarations
// emitted beside it by `tsc -p tsconfig.lib.json`.
export default defineConfig({
  publicDir: false,
  build: {
    outDir: 'dist/lib',
    emptyOutDir: false,
    lib: { entry: 'src/index.ts', formats: ['es'], fileName: () => 'lacuna.js' },
    minify: false,
    sourcemap: true,
  },
});
