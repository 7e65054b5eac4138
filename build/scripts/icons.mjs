#!/usr/bin/env node
// Renders build/icon.svg to the PNG sizes electron-builder uses (build/icons/NxN.png, build/icon.png).
// Needs Debian's Chromium; run by hand after changing the SVG: node build/scripts/icons.mjs
import { readFileSync } from 'node:fs';
import { chromium } from 'playwright-core';

const svg = readFileSync('build/icon.svg', 'utf8');
const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu'] });
for (const size of [16, 32, 48, 64, 128, 256, 512, 1024]) {
  const page = await browser.newPage({ viewport: { width: size, height: size } });
  await page.setContent(`<html><body style="margin:0;background:transparent">${svg.replace('<svg ', `<svg width="${size}" height="${size}" `)}</body></html>`);
  const path = size === 1024 ? 'build/icon.png' : `build/icons/${size}x${size}.png`;
  await page.screenshot({ path, omitBackground: true });
  await page.close();
}
await browser.close();
