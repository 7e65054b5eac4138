/** Electron main: composes the setup functions; nothing else lives here. */
import { app, BrowserWindow } from 'electron';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { setupEngineIpc } from './ipc';
import { setupMenu } from './menu';
import { createMainWindow, setupSessionSecurity } from './window';

const outDir = join(dirname(fileURLToPath(import.meta.url)), '..');
let mainWindow: BrowserWindow | null = null;

app.on('web-contents-created', (_e, contents) => {
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
  contents.on('will-navigate', (event) => event.preventDefault());
});

void app.whenReady().then(() => {
  setupSessionSecurity();
  setupEngineIpc((sender) => mainWindow !== null && sender === mainWindow.webContents);
  setupMenu(() => undefined);
  mainWindow = createMainWindow(outDir);
  mainWindow.on('closed', () => {
    mainWindow = null;
  });
});

app.on('window-all-closed', () => app.quit());
