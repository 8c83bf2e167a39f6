/**
 * Build of the command line for Node: `npm run build` writes dist/cli/ (ESM, dependencies left as
 * imports from node_modules), so `drydig` starts without compiling TypeScript (bin/drydig.js
 * uses it while it is not older than the sources). The worker threads (grid bands, the compute
 * pool) are entries of their own, beside the command.
 */
import { defineConfig } from 'vite';
import { fileURLToPath } from 'node:url';

const here = (path: string) => fileURLToPath(new URL(path, import.meta.url));

export default defineConfig({
  publicDir: false,
  logLevel: 'warn',
  build: {
    ssr: true,
    target: 'node20',
    outDir: here('../../dist/cli'),
    emptyOutDir: true,
    minify: false,
    sourcemap: false,
    rollupOptions: {
      input: { drydig: here('./index.ts'), 'grid-band-worker': here('./grid-band-thread.ts'), 'compute-worker': here('../compute/compute-worker-task.ts') },
      output: { format: 'es', entryFileNames: '[name].mjs', chunkFileNames: '[name]-[hash].mjs' },
    },
  },
});
