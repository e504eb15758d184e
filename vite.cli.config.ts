import { builtinModules } from 'node:module';
import { defineConfig } from 'vite';

// The CLI bundled for plain Node (bin/lacuna.mjs runs it when it is newer than the sources), so a call does not
// pay for compiling TypeScript on every start.
export default defineConfig({
  publicDir: false,
  build: {
    outDir: 'dist/cli',
    emptyOutDir: true,
    target: 'node20',
    minify: false,
    // Two entries: the command line, and the shard thread that `rank` starts on each core (src/cli/threads.ts).
    lib: { entry: { lacuna: 'src/cli/main.ts', shard: 'src/cli/shardWorker.ts' }, formats: ['es'], fileName: (_, name) => `${name}.js` },
    // resvg loads a native binary and linkedom is plain Node code: both stay in node_modules, not in the bundle.
    rollupOptions: { external: [...builtinModules, ...builtinModules.map((m) => `node:${m}`), '@resvg/resvg-js', 'linkedom'] },
  },
});
