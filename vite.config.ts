// The browser preview: the renderer alone, with the engine in a Web Worker.
import { defineConfig } from 'vite';
import vue from '@vitejs/plugin-vue';
import { fileURLToPath } from 'node:url';

export default defineConfig({
  root: 'renderer',
  base: './',
  plugins: [vue()],
  // workerpool's browser build names these Node modules on paths the browser never takes.
  resolve: {
    alias: Object.fromEntries(
      ['os', 'worker_threads', 'child_process'].map((m) => [m, fileURLToPath(new URL('./renderer/transport/node-builtins-shim.ts', import.meta.url))]),
    ),
  },
  build: {
    outDir: '../out/preview',
    emptyOutDir: true,
    target: 'es2022',
    chunkSizeWarningLimit: 1500,
    // No bundler timing table in a user's terminal (npm start, npm run preview, the e2e build).
    rolldownOptions: { checks: { pluginTimings: false } },
  },
  worker: { format: 'es' },
  preview: { host: '127.0.0.1', port: 4178, strictPort: false },
});
