import { describe, it, expect } from 'vitest';
import { existsSync, readFileSync } from 'node:fs';

interface BuilderConfig {
  appId: string;
  files: string[];
  linux: { target: string[]; icon: string };
  win: { target: string[] };
  mac: { target: string[] };
  icon: string;
}

describe('electron-builder configuration', () => {
  const cfg = JSON.parse(readFileSync('build/electron-builder.json', 'utf8')) as BuilderConfig;

  it('targets Linux AppImage and deb, Windows nsis and macOS dmg', () => {
    expect(cfg.linux.target).toEqual(['AppImage', 'deb']);
    expect(cfg.win.target).toEqual(['nsis']);
    expect(cfg.mac.target).toEqual(['dmg']);
  });

  it('points at icons that exist and packages only the built app', () => {
    expect(existsSync(cfg.icon)).toBe(true);
    for (const size of [16, 32, 48, 64, 128, 256, 512]) expect(existsSync(`${cfg.linux.icon}/${size}x${size}.png`)).toBe(true);
    expect(cfg.files.every((f) => f.startsWith('out/') || f === 'package.json')).toBe(true);
  });

  it('matches the package entry point to the main bundle', () => {
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { main: string };
    expect(pkg.main).toBe('out/main/main.js');
  });
});
