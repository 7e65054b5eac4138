// @vitest-environment node
import { describe, it, expect, vi, beforeEach } from 'vitest';
import { ENGINE_METHODS } from '../../shared-types';

const h = vi.hoisted(() => {
  const handles = new Map<string, (...args: unknown[]) => unknown>();
  const ons = new Map<string, (...args: unknown[]) => unknown>();
  const created: { options: Record<string, unknown>; wc: Record<string, unknown> }[] = [];
  class FakeWebContents {
    handlers: Record<string, (...a: unknown[]) => unknown> = {};
    windowOpen: ((d: unknown) => unknown) | undefined;
    setWindowOpenHandler(fn: (d: unknown) => unknown) { this.windowOpen = fn; }
    on(ev: string, fn: (...a: unknown[]) => unknown) { this.handlers[ev] = fn; }
    isDestroyed() { return false; }
    send = vi.fn();
  }
  class BrowserWindow {
    webContents = new FakeWebContents();
    constructor(public options: Record<string, unknown>) {
      created.push({ options, wc: this.webContents as unknown as Record<string, unknown> });
    }
    once() {}
    on() {}
    loadFile() { return Promise.resolve(); }
  }
  return { handles, ons, created, BrowserWindow, FakeWebContents };
});

vi.mock('electron', () => ({
  ipcMain: {
    handle: (ch: string, fn: (...a: unknown[]) => unknown) => h.handles.set(ch, fn),
    on: (ch: string, fn: (...a: unknown[]) => unknown) => h.ons.set(ch, fn),
  },
  BrowserWindow: h.BrowserWindow,
  session: { defaultSession: { webRequest: { onHeadersReceived: vi.fn() }, setPermissionRequestHandler: vi.fn() } },
  Menu: { setApplicationMenu: vi.fn(), buildFromTemplate: vi.fn((t: unknown) => t) },
}));

const { setupEngineIpc } = await import('../../electron/ipc');
const { createMainWindow, CONTENT_SECURITY_POLICY } = await import('../../electron/window');
const { demoPlantJson } = await import('../helpers/plants');

describe('electron main', () => {
  beforeEach(() => {
    h.handles.clear();
    h.ons.clear();
  });

  it('registers an IPC handler for every contract method, plus cancel', () => {
    setupEngineIpc(() => true);
    expect([...h.handles.keys()].sort()).toEqual([...ENGINE_METHODS].sort());
    expect(h.ons.has('engineCancel')).toBe(true);
  });

  it('answers a trusted describePlant call and refuses an unknown sender', async () => {
    const trusted = new h.FakeWebContents();
    setupEngineIpc((s) => s === (trusted as unknown));
    const fn = h.handles.get('describePlant')!;
    const ok = (await fn({ sender: trusted }, 1, { plant: demoPlantJson() })) as { ok: boolean };
    expect(ok.ok).toBe(true);
    const refused = (await fn({ sender: new h.FakeWebContents() }, 2, { plant: demoPlantJson() })) as { ok: boolean; error: { message: string } };
    expect(refused.ok).toBe(false);
    expect(refused.error.message).toContain('unknown sender');
  });

  it('creates the window isolated, sandboxed, without Node, and denies new windows and navigation', () => {
    createMainWindow('/app/out');
    const { options, wc } = h.created.at(-1)!;
    const prefs = options.webPreferences as Record<string, unknown>;
    expect(prefs.contextIsolation).toBe(true);
    expect(prefs.sandbox).toBe(true);
    expect(prefs.nodeIntegration).toBe(false);
    expect(prefs.webSecurity).toBe(true);
    expect(String(prefs.preload)).toMatch(/preload\.cjs$/);
    const windowOpen = (wc as unknown as { windowOpen: (d: unknown) => unknown }).windowOpen;
    expect(windowOpen({ url: 'https://example.invalid' })).toEqual({ action: 'deny' });
    const prevent = vi.fn();
    (wc as unknown as { handlers: Record<string, (e: unknown) => void> }).handlers['will-navigate']!({ preventDefault: prevent });
    expect(prevent).toHaveBeenCalled();
  });

  it('has a strict content security policy with no remote sources', () => {
    expect(CONTENT_SECURITY_POLICY).toContain("default-src 'self'");
    expect(CONTENT_SECURITY_POLICY).toContain("object-src 'none'");
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/unsafe-eval|unsafe-inline|https?:/);
  });
});
