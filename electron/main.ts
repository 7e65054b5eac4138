/** Electron main: composes the setup functions; nothing else lives here. */
import { app, BrowserWindow } from 'electron';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { fileFromArgv, setupFiles } from './files/setup-files';
import type { FilesService } from './files/setup-files';
import { setupEngineIpc } from './ipc';
import { createNodePool } from './pool/node-pool';
import { setupMenu } from './menu';
import { createMainWindow, guardWebContents, setupSessionSecurity } from './window';

const outDir = join(dirname(fileURLToPath(import.meta.url)), '..');
let mainWindow: BrowserWindow | null = null;
let files: FilesService | null = null;
/** A file handed over before the window was ready (command line, macOS "open-file"). */
let pendingFile: string | null = fileFromArgv(process.argv);

// One instance, so one recovery copy and one recent list: a second launch (say, opening a
// project from the file manager) hands its file to the running window and quits.
if (!app.requestSingleInstanceLock()) app.quit();
app.on('second-instance', (_e, argv, workingDirectory) => {
  if (!mainWindow) return;
  if (mainWindow.isMinimized()) mainWindow.restore();
  mainWindow.focus();
  const file = fileFromArgv(argv, workingDirectory);
  if (file) files?.openPath(file);
});
app.on('open-file', (event, path) => {
  event.preventDefault();
  if (files && mainWindow) files.openPath(path);
  else pendingFile = path;
});

app.on('web-contents-created', (_e, contents) => guardWebContents(contents));

void app.whenReady().then(async () => {
  setupSessionSecurity();
  const isTrusted = (sender: Electron.WebContents) => mainWindow !== null && sender === mainWindow.webContents;
  // Long engine jobs (tolerance samples, time-domain closing maps) on one worker thread per core, started on first use.
  const pool = createNodePool(join(dirname(fileURLToPath(import.meta.url)), 'pool-worker.js'));
  app.on('will-quit', () => void pool.close());
  setupEngineIpc(isTrusted, pool);
  const service = setupFiles({
    userDataDir: app.getPath('userData'),
    documentsDir: app.getPath('documents'),
    isTrusted,
    window: () => mainWindow,
    onRecentChanged: (recent) => setupMenu(service.command, recent),
  });
  files = service;
  setupMenu(service.command, await service.recent());
  mainWindow = createMainWindow(outDir);
  service.guardClose(mainWindow);
  mainWindow.webContents.once('did-finish-load', () => {
    if (pendingFile) service.openPath(pendingFile);
    pendingFile = null;
  });
  mainWindow.on('closed', () => {
    mainWindow = null;
  });
});

app.on('window-all-closed', () => app.quit());
