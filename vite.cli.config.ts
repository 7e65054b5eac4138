// Builds the Node CLI (electron/cli/main.ts) into one ESM file: out/cli/droopline.mjs.
import { defineConfig } from 'vite';

export default defineConfig({
  build: {
    ssr: 'electron/cli/main.ts',
    outDir: 'out/cli',
    emptyOutDir: true,
    target: 'node20',
    minify: false,
    rolldownOptions: {
      output: { entryFileNames: 'droopline.mjs', format: 'es' },
    },
  },
  ssr: { noExternal: true },
});
