/**
 * Prints a self-contained report page to PDF with Chromium's print engine, in a hidden window
 * that runs no script, has no preload and lives in its own in-memory session (the app's
 * Content-Security-Policy, which refuses inline styles, is not applied to it).
 */
import { BrowserWindow, session } from 'electron';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { guardWebContents, secureSession } from '../window';

/** The PDF window's session (in memory, apart from the app's). */
const PDF_PARTITION = 'droopline-report-pdf';
/** The report page needs its inline styles and inline SVG/images, and nothing else. */
export const PDF_CONTENT_SECURITY_POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; font-src data:; base-uri 'none'; form-action 'none'";
let pdfSessionReady = false;

/** Renders `html` (no scripts, no external resources) to A4 PDF bytes. */
export async function printHtmlToPdf(html: string): Promise<Uint8Array> {
  // A file, not a data: URL: a report with a closing map runs to megabytes.
  if (!pdfSessionReady) {
    secureSession(session.fromPartition(PDF_PARTITION), PDF_CONTENT_SECURITY_POLICY);
    pdfSessionReady = true;
  }
  const dir = await mkdtemp(join(tmpdir(), 'droopline-report-'));
  const page = join(dir, 'report.html');
  const win = new BrowserWindow({
    show: false,
    webPreferences: {
      partition: PDF_PARTITION,
      sandbox: true,
      contextIsolation: true,
      nodeIntegration: false,
      javascript: false,
      webSecurity: true,
    },
  });
  try {
    guardWebContents(win.webContents);
    await writeFile(page, html, 'utf8');
    await win.loadFile(page);
    const pdf = await win.webContents.printToPDF({ printBackground: true, pageSize: 'A4' });
    return new Uint8Array(pdf);
  } finally {
    win.destroy();
    await rm(dir, { recursive: true, force: true });
  }
}
