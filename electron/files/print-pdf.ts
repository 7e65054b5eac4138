/**
 * Prints a self-contained report page to PDF with Chromium's print engine, in a hidden window
 * that runs no script, has no preload and lives in its own in-memory session (the app's
 * Content-Security-Policy, which refuses inline styles, is not applied to it).
 */
import { BrowserWindow } from 'electron';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** Renders `html` (no scripts, no external resources) to A4 PDF bytes. */
export async function printHtmlToPdf(html: string): Promise<Uint8Array> {
  // A file, not a data: URL: a report with a closing map runs to megabytes.
  const dir = await mkdtemp(join(tmpdir(), 'droopline-report-'));
  const page = join(dir, 'report.html');
  const win = new BrowserWindow({
    show: false,
    webPreferences: {
      partition: 'droopline-report-pdf',
      sandbox: true,
      contextIsolation: true,
      nodeIntegration: false,
      javascript: false,
      webSecurity: true,
    },
  });
  try {
    win.webContents.setWindowOpenHandler(() => ({ action: 'deny' }));
    win.webContents.on('will-navigate', (event) => event.preventDefault());
    await writeFile(page, html, 'utf8');
    await win.loadFile(page);
    const pdf = await win.webContents.printToPDF({ printBackground: true, pageSize: 'A4' });
    return new Uint8Array(pdf);
  } finally {
    win.destroy();
    await rm(dir, { recursive: true, force: true });
  }
}
