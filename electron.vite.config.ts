// Electron build: main (ESM), preload (CommonJS, as sandboxed preloads must be) and the renderer.
import { resolve } from 'node:path';
import { defineConfig } from 'electron-vite';
import vue from '@vitejs/plugin-vue';

export default defineConfig({
  main: {
    build: {
      outDir: 'out/main',
      // The main process and the entry of its pool's worker threads (out/main/pool-worker.js).
      lib: { entry: { main: resolve('electron/main.ts'), 'pool-worker': resolve('electron/pool/pool-worker.ts') } },
      rollupOptions: { external: ['electron'] },
    },
  },
  preload: {
    build: {
      outDir: 'out/preload',
      lib: { entry: resolve('electron/preload.ts'), formats: ['cjs'], fileName: () => 'preload.cjs' },
      rollupOptions: { external: ['electron'] },
    },
  },
  renderer: {
    root: 'renderer',
    plugins: [vue()],
    build: {
      outDir: 'out/renderer',
      rollupOptions: { input: resolve('renderer/index.html') },
    },
    worker: { format: 'es' },
  },
});
