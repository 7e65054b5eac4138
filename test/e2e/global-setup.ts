/**
 * Builds the browser preview once and serves it on 127.0.0.1 for the e2e files
 * (in-process through Vite's preview API, so no orphan server is left behind).
 */
import { rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { build, preview } from 'vite';
import type { TestProject } from 'vitest/node';
import { ensureChromium } from '../../build/scripts/ensure-chromium.mjs';
import { PREVIEW_HEADERS } from '../../build/scripts/security-headers.mjs';

declare module 'vitest' {
  export interface ProvidedContext {
    previewUrl: string;
  }
}

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  ensureChromium();
  // A folder of this run's own, so parallel runs never serve each other's half-built files.
  const outDir = resolve('out', `e2e-preview-${process.pid}`);
  await build({ logLevel: 'warn', build: { outDir, emptyOutDir: true } });
  const server = await preview({
    build: { outDir },
    preview: { host: '127.0.0.1', port: 0, strictPort: false, open: false, headers: PREVIEW_HEADERS },
    logLevel: 'warn',
  });
  const url = server.resolvedUrls?.local[0];
  if (!url) throw new Error('The preview server did not report its URL.');
  project.provide('previewUrl', url);
  return async () => {
    await new Promise<void>((done) => server.httpServer.close(() => done()));
    rmSync(outDir, { recursive: true, force: true });
  };
}
