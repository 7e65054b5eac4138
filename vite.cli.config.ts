// Builds the Node CLI (electron/cli/main.ts) into ESM files in out/cli: droopline.mjs, and pool-worker.mjs, the
// entry of its worker threads (electron/pool/pool-worker.ts), with any code they share in a chunk beside them.
import { defineConfig } from 'vite';

export default defineConfig({
  build: {
    ssr: true,
    outDir: 'out/cli',
    emptyOutDir: true,
    target: 'node20',
    minify: false,
    rolldownOptions: {
      input: { droopline: 'electron/cli/main.ts', 'pool-worker': 'electron/pool/pool-worker.ts' },
      output: { entryFileNames: '[name].mjs', chunkFileNames: '[name]-[hash].mjs', format: 'es' },
    },
  },
  ssr: { noExternal: true },
});
