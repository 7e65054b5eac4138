// @vitest-environment node
import { describe, it, expect, vi } from 'vitest';
import { existsSync } from 'node:fs';

const h = vi.hoisted(() => {
  const made: {
    options: { show: boolean; webPreferences: Record<string, unknown> };
    loaded: string[];
    pageText: string[];
    destroyed: number;
    openHandler?: () => unknown;
  }[] = [];
  class BrowserWindow {
    rec: (typeof made)[number];
    webContents: Record<string, unknown>;
    constructor(options: (typeof made)[number]['options']) {
      this.rec = { options, loaded: [], pageText: [], destroyed: 0 };
      made.push(this.rec);
      const rec = this.rec;
      this.webContents = {
        setWindowOpenHandler: (fn: () => unknown) => (rec.openHandler = fn),
        on: vi.fn(),
        printToPDF: vi.fn(() => Promise.resolve(Buffer.from('%PDF-1.7 fake'))),
      };
    }
    async loadFile(path: string) {
      const { readFileSync: read } = await import('node:fs');
      this.rec.loaded.push(path);
      this.rec.pageText.push(read(path, 'utf8'));
    }
    destroy() {
      this.rec.destroyed++;
    }
  }
  return { made, BrowserWindow };
});

const s = vi.hoisted(() => {
  const hooks: Record<string, (...a: unknown[]) => unknown> = {};
  const partitions: string[] = [];
  const session = {
    webRequest: {
      onHeadersReceived: (fn: (...a: unknown[]) => unknown) => (hooks.headers = fn),
      onBeforeRequest: (fn: (...a: unknown[]) => unknown) => (hooks.request = fn),
    },
    setPermissionRequestHandler: (fn: (...a: unknown[]) => unknown) => (hooks.permission = fn),
    setPermissionCheckHandler: (fn: (...a: unknown[]) => unknown) => (hooks.check = fn),
  };
  return { hooks, partitions, session };
});
vi.mock('electron', () => ({
  BrowserWindow: h.BrowserWindow,
  session: {
    fromPartition: (p: string) => {
      s.partitions.push(p);
      return s.session;
    },
  },
}));
const { printHtmlToPdf, PDF_CONTENT_SECURITY_POLICY } = await import('../../electron/files/print-pdf');

describe('printHtmlToPdf', () => {
  it('prints the page in a hidden window that runs no script, then cleans up', async () => {
    const bytes = await printHtmlToPdf('<h1>Kestrel Ford report</h1>');
    expect(new TextDecoder().decode(bytes)).toBe('%PDF-1.7 fake');
    const w = h.made.at(-1)!;
    expect(w.options.show).toBe(false);
    expect(w.options.webPreferences).toMatchObject({ javascript: false, sandbox: true, contextIsolation: true, nodeIntegration: false });
    expect(w.options.webPreferences.preload).toBeUndefined();
    expect(w.openHandler?.()).toEqual({ action: 'deny' });
    expect(w.pageText).toEqual(['<h1>Kestrel Ford report</h1>']);
    expect(existsSync(w.loaded[0]!)).toBe(false);
    expect(w.destroyed).toBe(1);
  });

  it("gives the PDF window's own session a CSP of its own and no network", async () => {
    await printHtmlToPdf('<p>x</p>');
    expect(s.partitions).toEqual(['droopline-report-pdf']); // set up once
    let headers: { responseHeaders: Record<string, string[]> } | undefined;
    s.hooks.headers!({ responseHeaders: {} }, (r: typeof headers) => (headers = r));
    expect(headers!.responseHeaders['Content-Security-Policy']).toEqual([PDF_CONTENT_SECURITY_POLICY]);
    expect(PDF_CONTENT_SECURITY_POLICY).toContain("default-src 'none'");
    expect(PDF_CONTENT_SECURITY_POLICY).not.toMatch(/script-src|https?:/);
    let r: { cancel: boolean } | undefined;
    s.hooks.request!({ url: 'https://example.invalid/track.png' }, (x: typeof r) => (r = x));
    expect(r).toEqual({ cancel: true });
    expect(s.hooks.check!()).toBe(false);
  });
});
