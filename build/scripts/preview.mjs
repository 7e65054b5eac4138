#!/usr/bin/env node
// Browser preview: builds the renderer (engine in a Web Worker) and serves it on 127.0.0.1.
// Usage: node build/scripts/preview.mjs [--port N] [--no-build]
import { build, preview } from 'vite';
import { parsePort, PREVIEW_HEADERS } from './security-headers.mjs';

// The shared caution (`CAUTION` in shared-types/presentation.ts; a unit test keeps the two equal).
export const PREVIEW_CAUTION =
  "Planning and training only. Verify against makers' data, protection studies, local codes and licensed practice. Closing out of phase can damage machines and injure people.";

const args = process.argv.slice(2);
const parsed = parsePort(args);
if ('error' in parsed) {
  process.stderr.write(`droopline preview: ${parsed.error}\n`);
  process.exit(2);
}
const { port } = parsed;

if (!args.includes('--no-build')) {
  await build({ logLevel: 'warn' });
}
const server = await preview({ preview: { host: '127.0.0.1', port, strictPort: false, open: false, headers: PREVIEW_HEADERS }, logLevel: 'warn' });
const url = server.resolvedUrls?.local[0] ?? `http://127.0.0.1:${port}/`;
const used = Number(new URL(url).port);
const busy = used !== port ? `Port ${port} is in use; serving on port ${used} instead.\n` : '';
process.stdout.write(
  `${busy}Droopline browser preview: ${url}\n(Ctrl+C to stop.)\nCaution: ${PREVIEW_CAUTION.charAt(0).toLowerCase()}${PREVIEW_CAUTION.slice(1)}\n`,
);
