/** The main window and its security settings. */
import { BrowserWindow, session } from 'electron';
import { join } from 'node:path';

/** Options every Droopline window uses: isolated, sandboxed, no Node in the page. */
export function secureWebPreferences(preloadPath: string): Electron.WebPreferences {
  return {
    preload: preloadPath,
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    webSecurity: true,
    allowRunningInsecureContent: false,
    webviewTag: false,
    spellcheck: false,
  };
}

/** The Content-Security-Policy sent with every response (no remote content). */
export const CONTENT_SECURITY_POLICY =
  "default-src 'self'; script-src 'self'; worker-src 'self' blob:; style-src 'self'; img-src 'self' data: blob:; font-src 'self'; connect-src 'self'; object-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

/** URL schemes a Droopline page may load: its own files, worker blobs and inline images. */
const LOCAL_SCHEMES = ['file:', 'blob:', 'data:', 'devtools:'];

/** Whether a request stays on the machine (no network: the app has no remote content). */
export function isLocalRequest(url: string): boolean {
  try {
    return LOCAL_SCHEMES.includes(new URL(url).protocol);
  } catch {
    return false;
  }
}

/**
 * Hardens a session: the CSP header on every response, every permission request and check
 * refused (no camera, notifications, clipboard-read… the app needs none), and any request
 * that would leave the machine cancelled.
 */
export function secureSession(ses: Electron.Session, csp: string): void {
  ses.webRequest.onHeadersReceived((details, callback) => {
    callback({ responseHeaders: { ...details.responseHeaders, 'Content-Security-Policy': [csp] } });
  });
  ses.webRequest.onBeforeRequest((details, callback) => callback({ cancel: !isLocalRequest(details.url) }));
  ses.setPermissionRequestHandler((_wc, _permission, callback) => callback(false));
  ses.setPermissionCheckHandler(() => false);
}

/** Applies `secureSession` with the app's CSP to the default session. */
export function setupSessionSecurity(): void {
  secureSession(session.defaultSession, CONTENT_SECURITY_POLICY);
}

/**
 * Guards any web contents the app creates (main window, PDF window, anything else): no new
 * windows, no navigation, redirect or frame navigation away, no webview.
 */
export function guardWebContents(contents: Electron.WebContents): void {
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
  const stop = (event: { preventDefault(): void }) => event.preventDefault();
  contents.on('will-navigate', stop);
  contents.on('will-redirect', stop);
  contents.on('will-frame-navigate', stop);
  contents.on('will-attach-webview', stop);
}

/** Creates the main window; navigation away and new windows are denied. */
export function createMainWindow(outDir: string): BrowserWindow {
  const win = new BrowserWindow({
    width: 1360,
    height: 880,
    minWidth: 960,
    minHeight: 640,
    title: 'Droopline',
    show: false,
    webPreferences: secureWebPreferences(join(outDir, 'preload', 'preload.cjs')),
  });
  guardWebContents(win.webContents);
  win.once('ready-to-show', () => win.show());
  void win.loadFile(join(outDir, 'renderer', 'index.html'));
  return win;
}
