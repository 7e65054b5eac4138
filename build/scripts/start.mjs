#!/usr/bin/env node
// `npm start`: launches the Electron app where its binary is installed, otherwise says so
// in one line and serves the same UI as the browser preview.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

function electronBinary() {
  if (process.env.ELECTRON_OVERRIDE_DIST_PATH) {
    const p = join(process.env.ELECTRON_OVERRIDE_DIST_PATH, process.platform === 'win32' ? 'electron.exe' : 'electron');
    return existsSync(p) ? p : null;
  }
  try {
    const pkgDir = dirname(createRequire(import.meta.url).resolve('electron/package.json'));
    const pathFile = join(pkgDir, 'path.txt');
    if (!existsSync(pathFile)) return null;
    const bin = join(pkgDir, 'dist', readFileSync(pathFile, 'utf8').trim());
    return existsSync(bin) ? bin : null;
  } catch {
    return null;
  }
}

const bin = electronBinary();
if (bin) {
  const built = spawnSync(process.execPath, [join('node_modules', 'electron-vite', 'bin', 'electron-vite.js'), 'build'], { stdio: 'inherit' });
  if (built.status !== 0) process.exit(built.status ?? 1);
  const child = spawn(bin, ['.'], { stdio: 'inherit' });
  child.on('exit', (code) => process.exit(code ?? 0));
} else {
  process.stdout.write('Electron binary not installed here; serving the same UI as the browser preview instead.\n');
  await import('./preview.mjs');
}
