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

/** Applies the CSP header and refuses permission requests for the default session. */
export function setupSessionSecurity(): void {
  session.defaultSession.webRequest.onHeadersReceived((details, callback) => {
    callback({ responseHeaders: { ...details.responseHeaders, 'Content-Security-Policy': [CONTENT_SECURITY_POLICY] } });
  });
  session.defaultSession.setPermissionRequestHandler((_wc, _permission, callback) => callback(false));
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
  win.webContents.setWindowOpenHandler(() => ({ action: 'deny' }));
  win.webContents.on('will-navigate', (event) => event.preventDefault());
  win.webContents.on('will-attach-webview', (event) => event.preventDefault());
  win.once('ready-to-show', () => win.show());
  void win.loadFile(join(outDir, 'renderer', 'index.html'));
  return win;
}
