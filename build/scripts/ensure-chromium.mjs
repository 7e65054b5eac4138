#!/usr/bin/env node
// The end-to-end tests need Chromium and are never skipped. When it is missing, install Debian's
// package where we can (root with apt-get, as on a fresh CI machine); otherwise stop at once with
// the one command to run. `npm test` runs this first; the e2e set-up calls `ensureChromium()` too.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const INSTALL_COMMAND = 'sudo apt-get update && sudo apt-get install -y chromium';

/** Returns when Chromium is at CHROMIUM_PATH (installing it as root with apt-get if need be); throws otherwise. */
export function ensureChromium() {
  if (existsSync(CHROMIUM_PATH)) return;
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (isRoot && existsSync('/usr/bin/apt-get') && !process.env.CHROMIUM_PATH) {
    process.stdout.write("Chromium is missing; installing Debian's chromium package with apt-get (about a minute)…\n");
    const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
    for (const args of [
      ['update', '-qq'],
      ['install', '-y', '-qq', 'chromium'],
    ]) {
      const r = spawnSync('apt-get', args, { stdio: ['ignore', 'ignore', 'inherit'], env });
      if (r.status !== 0) throw new Error(`Installing Chromium failed (apt-get ${args.join(' ')}). Run: ${INSTALL_COMMAND}`);
    }
    if (existsSync(CHROMIUM_PATH)) return;
  }
  throw new Error(
    `The end-to-end tests need Chromium, which is missing at ${CHROMIUM_PATH}. Run: ${INSTALL_COMMAND} (or set CHROMIUM_PATH to a Chromium binary), then npm test again.`,
  );
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  try {
    ensureChromium();
  } catch (e) {
    process.stderr.write(`${e instanceof Error ? e.message : String(e)}\n`);
    process.exit(1);
  }
}
