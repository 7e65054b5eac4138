#!/usr/bin/env node
// Launcher of the `droopline` command: runs the CLI bundle built by `npm install` (prepare).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
const bundle = fileURLToPath(new URL('../../out/cli/droopline.mjs', import.meta.url));
if (!existsSync(bundle)) {
  process.stderr.write('droopline: the CLI is not built yet; run "npm run build:cli" (npm install does it too).\n');
  process.exit(1);
}
await import(bundle);
