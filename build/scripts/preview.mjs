#!/usr/bin/env node
// Browser preview: builds the renderer (engine in a Web Worker) and serves it on 127.0.0.1.
// Usage: node build/scripts/preview.mjs [--port N] [--no-build]
import { build, preview } from 'vite';

const args = process.argv.slice(2);
const portArg = args.indexOf('--port');
const port = portArg >= 0 ? Number(args[portArg + 1]) : 4178;

if (!args.includes('--no-build')) {
  await build({ logLevel: 'warn' });
}
const server = await preview({ preview: { host: '127.0.0.1', port, strictPort: false, open: false }, logLevel: 'warn' });
const url = server.resolvedUrls?.local[0] ?? `http://127.0.0.1:${port}/`;
process.stdout.write(`Droopline browser preview: ${url}\n(Ctrl+C to stop. Planning and training only: verify against makers' data and licensed practice.)\n`);
