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
    setWindowOpenHandler(fn: (d: unknown) => unknown) {
      this.windowOpen = fn;
    }
    on(ev: string, fn: (...a: unknown[]) => unknown) {
      this.handlers[ev] = fn;
    }
    isDestroyed() {
      return false;
    }
    send = vi.fn();
  }
  class BrowserWindow {
    webContents = new FakeWebContents();
    constructor(public options: Record<string, unknown>) {
      created.push({ options, wc: this.webContents as unknown as Record<string, unknown> });
    }
    once() {}
    on() {}
    loadFile() {
      return Promise.resolve();
    }
  }
  /** A session whose hooks the tests call as Electron would. */
  function fakeSession() {
    const hooks: Record<string, (...a: unknown[]) => unknown> = {};
    return {
      hooks,
      webRequest: {
        onHeadersReceived: (fn: (...a: unknown[]) => unknown) => (hooks.headers = fn),
        onBeforeRequest: (fn: (...a: unknown[]) => unknown) => (hooks.request = fn),
      },
      setPermissionRequestHandler: (fn: (...a: unknown[]) => unknown) => (hooks.permission = fn),
      setPermissionCheckHandler: (fn: (...a: unknown[]) => unknown) => (hooks.check = fn),
    };
  }
  const defaultSession = fakeSession();
  return { handles, ons, created, BrowserWindow, FakeWebContents, defaultSession, fakeSession };
});

vi.mock('electron', () => ({
  ipcMain: {
    handle: (ch: string, fn: (...a: unknown[]) => unknown) => h.handles.set(ch, fn),
    on: (ch: string, fn: (...a: unknown[]) => unknown) => h.ons.set(ch, fn),
  },
  BrowserWindow: h.BrowserWindow,
  session: { defaultSession: h.defaultSession, fromPartition: () => h.fakeSession() },
  Menu: { setApplicationMenu: vi.fn(), buildFromTemplate: vi.fn((t: unknown) => t) },
}));

const { setupEngineIpc } = await import('../../electron/ipc');
const { createMainWindow, CONTENT_SECURITY_POLICY, guardWebContents, isLocalRequest, setupSessionSecurity } = await import('../../electron/window');
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

  it('installs the CSP on every response, refuses every permission and any request off the machine', () => {
    setupSessionSecurity();
    const hooks = h.defaultSession.hooks;
    let headers: unknown;
    hooks.headers!({ responseHeaders: { 'X-Kept': ['1'] } }, (r: unknown) => (headers = r));
    expect(headers).toEqual({ responseHeaders: { 'X-Kept': ['1'], 'Content-Security-Policy': [CONTENT_SECURITY_POLICY] } });
    const granted: boolean[] = [];
    hooks.permission!({}, 'media', (ok: boolean) => granted.push(ok));
    hooks.permission!({}, 'clipboard-read', (ok: boolean) => granted.push(ok));
    expect(granted).toEqual([false, false]);
    expect(hooks.check!({}, 'notifications')).toBe(false);
    const decide = (url: string) => {
      let r: { cancel: boolean } | undefined;
      hooks.request!({ url }, (x: { cancel: boolean }) => (r = x));
      return r!.cancel;
    };
    expect(decide('file:///opt/droopline/renderer/index.html')).toBe(false);
    expect(decide('blob:file:///5b1e')).toBe(false);
    expect(decide('https://example.invalid/x.js')).toBe(true);
    expect(decide('ws://127.0.0.1:9229')).toBe(true);
    expect(isLocalRequest('not a url')).toBe(false);
  });

  it('guards any web contents: no new window, navigation, redirect, frame navigation or webview', () => {
    const wc = new h.FakeWebContents();
    guardWebContents(wc as never);
    expect(wc.windowOpen!({ url: 'https://example.invalid' })).toEqual({ action: 'deny' });
    for (const ev of ['will-navigate', 'will-redirect', 'will-frame-navigate', 'will-attach-webview']) {
      const prevent = vi.fn();
      wc.handlers[ev]!({ preventDefault: prevent });
      expect(prevent, ev).toHaveBeenCalled();
    }
  });

  it('cancels a running job only for our own window', async () => {
    const trusted = new h.FakeWebContents();
    setupEngineIpc((s) => s === (trusted as unknown));
    const run = h.handles.get('simulate')!;
    const cancel = h.ons.get('engineCancel')!;
    const scenario = { plant: demoPlantJson(), durationS: 4, stepMs: 1, events: [] };
    // A stranger's cancel is ignored: the run completes.
    const a = run({ sender: trusted }, 11, scenario) as Promise<{ ok: boolean }>;
    cancel({ sender: new h.FakeWebContents() }, { id: 11 });
    expect((await a).ok).toBe(true);
    // Our window's cancel stops it.
    const b = run({ sender: trusted }, 12, scenario) as Promise<{ ok: boolean; error?: { code: string } }>;
    cancel({ sender: trusted }, { id: 12 });
    const stopped = await b;
    expect(stopped.ok).toBe(false);
    expect(stopped.error?.code).toBe('CANCELLED');
  });

  it('has a strict content security policy with no remote sources', () => {
    expect(CONTENT_SECURITY_POLICY).toContain("default-src 'self'");
    expect(CONTENT_SECURITY_POLICY).toContain("object-src 'none'");
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/unsafe-eval|unsafe-inline|https?:/);
  });

  it('the browser preview sends the same policy', async () => {
    const { PREVIEW_CSP, PREVIEW_HEADERS } = await import('../../build/scripts/security-headers.mjs');
    expect(PREVIEW_CSP).toBe(CONTENT_SECURITY_POLICY);
    expect(PREVIEW_HEADERS['Content-Security-Policy']).toBe(CONTENT_SECURITY_POLICY);
  });
});
