// @vitest-environment node
import { describe, it, expect, vi, beforeEach, afterEach } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { HOST_METHODS, HOST_OPEN_DROPPED } from '../../shared-types';
import type { HostMethod, HostOutcome } from '../../shared-types';
import { projectText } from '../helpers/projects';

const h = vi.hoisted(() => {
  const handles = new Map<string, (...args: unknown[]) => unknown>();
  const dialog = { showOpenDialog: vi.fn(), showSaveDialog: vi.fn(), showMessageBox: vi.fn() };
  class FakeWindow {
    listeners: Record<string, ((e: { preventDefault(): void }) => void)[]> = {};
    closed = 0;
    webContents = { send: vi.fn() };
    setDocumentEdited = vi.fn();
    setRepresentedFilename = vi.fn();
    isDestroyed() {
      return false;
    }
    on(ev: string, fn: (e: { preventDefault(): void }) => void) {
      (this.listeners[ev] ??= []).push(fn);
    }
    /** Runs the close listeners like Electron does; returns whether the window closed. */
    close(): boolean {
      let prevented = false;
      for (const fn of this.listeners.close ?? [])
        fn({
          preventDefault: () => {
            prevented = true;
          },
        });
      if (!prevented) this.closed++;
      return !prevented;
    }
  }
  return { handles, dialog, FakeWindow };
});

vi.mock('electron', () => ({
  ipcMain: { handle: (ch: string, fn: (...a: unknown[]) => unknown) => h.handles.set(ch, fn) },
  dialog: h.dialog,
}));

const { setupFiles, fileFromArgv, fileNameFor } = await import('../../electron/files/setup-files');
type Service = ReturnType<typeof setupFiles>;

// HOST_METHODS is derived from a record that `satisfies Record<HostMethod, true>` (shared-types/host-api.ts).

let dir: string;
let userData: string;
let win: InstanceType<typeof h.FakeWindow>;
let service: Service;
const me = { id: 'our window' };
const recentSeen: unknown[] = [];
/** Report pages handed to the (fake) print engine. */
const printed: string[] = [];

function start(): Service {
  h.handles.clear();
  return setupFiles({
    userDataDir: userData,
    documentsDir: dir,
    isTrusted: (s) => s === (me as unknown),
    window: () => win as never,
    onRecentChanged: (files) => recentSeen.push(files),
    now: () => new Date('2026-12-02T03:00:00.000Z'),
    printPdf: (html) => {
      printed.push(html);
      return Promise.resolve(new TextEncoder().encode('%PDF-1.7 test'));
    },
  });
}

async function call<T = unknown>(method: HostMethod, request: unknown = {}, sender: unknown = me): Promise<HostOutcome<T>> {
  return (await h.handles.get(method)!({ sender }, request)) as HostOutcome<T>;
}
async function value<T>(method: HostMethod, request: unknown = {}): Promise<T> {
  const r = await call<T>(method, request);
  if (!r.ok) throw new Error(r.error.message);
  return r.value;
}

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'droopline-files-'));
  userData = join(dir, 'user-data');
  win = new h.FakeWindow();
  recentSeen.length = 0;
  printed.length = 0;
  vi.clearAllMocks();
  service = start();
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

describe('file service (Electron main)', () => {
  it('registers one handler per host method and refuses other senders', async () => {
    expect([...h.handles.keys()].sort()).toEqual([...HOST_METHODS, HOST_OPEN_DROPPED].sort());
    const r = await call('recentList', {}, { id: 'someone else' });
    expect(r).toEqual({ ok: false, error: { name: 'HostError', code: 'REFUSED', message: 'Request refused: unknown sender.' } });
  });

  it('checks every payload and names the field and the rule', async () => {
    const r = await call('fileSave', { path: '', text: 5 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.message).toBe('path: must not be empty\ntext: must be text');
  });

  it('opens a file by path with its text and notes a backup beside it', async () => {
    const file = join(dir, 'study.droopline.json');
    writeFileSync(file, projectText());
    service.offer(file);
    const first = await value<{ text: string; backupPath: string | null; fileName: string }>('fileOpenPath', { path: file });
    expect(first.text).toBe(projectText());
    expect(first.fileName).toBe('study.droopline.json');
    expect(first.backupPath).toBeNull();
    writeFileSync(`${file}.bak`, projectText());
    expect((await value<{ backupPath: string }>('fileOpenPath', { path: file })).backupPath).toBe(`${file}.bak`);
  });

  it('says clearly when a file is missing or is not a Droopline file', async () => {
    service.offer(join(dir, 'gone.json'));
    const gone = await call('fileOpenPath', { path: join(dir, 'gone.json') });
    expect(!gone.ok && gone.error).toEqual({ name: 'HostError', code: 'NOT_FOUND', message: '"gone.json" was not found. It may have been moved or deleted.' });
    const text = await call('fileOpenPath', { path: join(dir, 'notes.txt') });
    expect(!text.ok && text.error.message).toBe(
      '"notes.txt" is not a Droopline file: Droopline opens project and plant files (.json) and their backups (.bak).',
    );
  });

  it('opens by path only what the host offered: never a path the page names on its own', async () => {
    const secret = join(dir, 'elsewhere', 'secret.json');
    mkdirSync(join(dir, 'elsewhere'));
    writeFileSync(secret, '{"token": "do not show"}');
    const r = await call('fileOpenPath', { path: secret });
    expect(!r.ok && r.error).toEqual({
      name: 'HostError',
      code: 'REFUSED',
      message: 'Droopline opens "secret.json" only from the Open dialog, a dropped file, the recent list or the command line.',
    });
    expect(JSON.stringify(r)).not.toContain('do not show');
    // Relative paths are no way round it either.
    expect((await call('fileOpenPath', { path: 'secret.json' })).ok).toBe(false);
    // Nor is naming the file as the document: it never reaches the recent list.
    const named = await call('documentState', { projectName: 'x', fileName: 'secret.json', path: secret, dirty: false });
    expect(!named.ok && named.error.code).toBe('REFUSED');
    expect(await value('recentList')).toEqual([]);
    expect((await call('fileOpenPath', { path: secret })).ok).toBe(false);
    // And a refused path gains no write access.
    expect((await call('fileSave', { path: secret, text: projectText() })).ok).toBe(false);
    expect(readFileSync(secret, 'utf8')).toBe('{"token": "do not show"}');
  });

  it('opens a path from the command line, the recent list or beside an opened file (its backup)', async () => {
    const file = join(dir, 'site.droopline.json');
    writeFileSync(file, projectText());
    writeFileSync(`${file}.bak`, projectText({ name: 'Older' }));
    service.openPath(file); // the command line
    expect(win.webContents.send).toHaveBeenLastCalledWith('hostCommand', { command: 'open-path', path: file });
    const opened = await value<{ backupPath: string }>('fileOpenPath', { path: file });
    expect(opened.backupPath).toBe(`${file}.bak`);
    expect((await value<{ text: string }>('fileOpenPath', { path: `${file}.bak` })).text).toBe(projectText({ name: 'Older' }));
    await value('documentState', { projectName: 'Site', fileName: 'site.droopline.json', path: file, dirty: false });
    // A new session (next start): the file is on the recent list, so it opens by path.
    service = start();
    expect((await value<{ text: string }>('fileOpenPath', { path: file })).text).toBe(projectText());
  });

  it("opens a dropped file through the preload's own channel, from our window only", async () => {
    const file = join(dir, 'dropped.droopline.json');
    writeFileSync(file, projectText());
    const drop = (request: unknown, sender: unknown = me) => h.handles.get(HOST_OPEN_DROPPED)!({ sender }, request) as Promise<HostOutcome<{ text: string }>>;
    const r = await drop({ path: file });
    expect(r.ok && r.value.text).toBe(projectText());
    // It may then be saved in place.
    expect((await call('fileSave', { path: file, text: projectText({ name: 'Saved' }) })).ok).toBe(true);
    expect(await drop({ path: file }, { id: 'someone else' })).toEqual({
      ok: false,
      error: { name: 'HostError', code: 'REFUSED', message: 'Request refused: unknown sender.' },
    });
    const txt = await drop({ path: join(dir, 'notes.txt') });
    expect(!txt.ok && txt.error.code).toBe('REFUSED');
    const bad = await drop({ path: 5 });
    expect(!bad.ok && bad.error.message).toBe('path: must be text');
  });

  it('removes temporary files of saves that died, at start and on open; a fresh one (a save running) stays', async () => {
    const { utimesSync, readdirSync } = await import('node:fs');
    const file = join(dir, 'site.droopline.json');
    writeFileSync(file, projectText());
    service.offer(file);
    await value('fileOpenPath', { path: file });
    await value('documentState', { projectName: 'Site', fileName: 'site.droopline.json', path: file, dirty: false });
    await value('recoveryWrite', { projectName: 'Site', path: null, fileName: null, text: projectText() });
    // A crash left temporaries beside the project and beside the recovery copy.
    const old = new Date(Date.now() - 60 * 60 * 1000);
    const deadProject = join(dir, '.site.droopline.json.0a1b2c.tmp');
    const deadRecovery = join(userData, 'recovery', '.recovery.json.3d4e5f.tmp');
    const running = join(dir, '.site.droopline.json.777777.tmp');
    for (const f of [deadProject, deadRecovery, running]) writeFileSync(f, 'partial');
    utimesSync(deadProject, old, old);
    utimesSync(deadRecovery, old, old);
    service = start(); // the next start
    await service.cleaned();
    expect(readdirSync(dir)).not.toContain('.site.droopline.json.0a1b2c.tmp');
    expect(readdirSync(join(userData, 'recovery'))).not.toContain('.recovery.json.3d4e5f.tmp');
    expect(readdirSync(dir)).toContain('.site.droopline.json.777777.tmp');
    // On open, too.
    writeFileSync(deadProject, 'partial');
    utimesSync(deadProject, old, old);
    await value('fileOpenPath', { path: file });
    await vi.waitFor(() => expect(readdirSync(dir)).not.toContain('.site.droopline.json.0a1b2c.tmp'));
  });

  it('saves only to files the user opened or chose', async () => {
    const elsewhere = join(dir, 'elsewhere.json');
    const r = await call('fileSave', { path: elsewhere, text: projectText() });
    expect(!r.ok && r.error.code).toBe('REFUSED');
    expect(existsSync(elsewhere)).toBe(false);
  });

  it('round-trips: save, open again, identical text; the previous file becomes the backup', async () => {
    const file = join(dir, 'study.droopline.json');
    const original = projectText({ name: 'First' });
    writeFileSync(file, original);
    service.offer(file);
    await value('fileOpenPath', { path: file });
    const edited = projectText({ name: 'Second' });
    const saved = await value<{ backupFileName: string; savedAt: string }>('fileSave', { path: file, text: edited });
    expect(saved.backupFileName).toBe('study.droopline.json.bak');
    expect(saved.savedAt).toBe('2026-12-02T03:00:00.000Z');
    expect(readFileSync(`${file}.bak`, 'utf8')).toBe(original);
    expect((await value<{ text: string }>('fileOpenPath', { path: file })).text).toBe(edited);
  });

  it('refuses to write text that would not open again, leaving the file untouched', async () => {
    const file = join(dir, 'study.droopline.json');
    writeFileSync(file, projectText());
    service.offer(file);
    await value('fileOpenPath', { path: file });
    const r = await call('fileSave', { path: file, text: projectText().slice(0, 200) });
    expect(!r.ok && r.error.code).toBe('INVALID_INPUT');
    expect(!r.ok && r.error.message).toContain('The project was not saved because it would not open again');
    expect(readFileSync(file, 'utf8')).toBe(projectText());
    expect(existsSync(`${file}.bak`)).toBe(false);
  });

  it('Save As asks for a place, adds the project suffix and then allows Save there', async () => {
    h.dialog.showSaveDialog.mockResolvedValue({ canceled: false, filePath: join(dir, 'new study') });
    const saved = await value<{ path: string }>('fileSaveAs', { suggestedName: 'A/B: study', text: projectText() });
    expect(saved.path).toBe(join(dir, 'new study.droopline.json'));
    expect(h.dialog.showSaveDialog.mock.calls[0]![1].defaultPath).toBe(join(dir, 'A B study.droopline.json'));
    expect((await call('fileSave', { path: saved.path, text: projectText() })).ok).toBe(true);
    h.dialog.showSaveDialog.mockResolvedValue({ canceled: true, filePath: '' });
    expect(await value('fileSaveAs', { suggestedName: 'x', text: projectText() })).toBeNull();
  });

  it('saves a report as PDF where the user chooses, adding .pdf, and returns null on cancel', async () => {
    h.dialog.showSaveDialog.mockResolvedValue({ canceled: false, filePath: join(dir, 'works report') });
    const saved = await value<{ path: string; backupFileName: string | null }>('reportSavePdf', { html: '<h1>Report</h1>', suggestedName: 'works: report' });
    expect(saved.path).toBe(join(dir, 'works report.pdf'));
    expect(saved.backupFileName).toBeNull();
    expect(readFileSync(saved.path, 'utf8')).toBe('%PDF-1.7 test');
    expect(printed).toEqual(['<h1>Report</h1>']);
    expect(h.dialog.showSaveDialog.mock.calls[0]![1].defaultPath).toBe(join(dir, 'works- report.pdf'));
    h.dialog.showSaveDialog.mockResolvedValue({ canceled: true, filePath: '' });
    expect(await value('reportSavePdf', { html: '<p></p>', suggestedName: 'x' })).toBeNull();
    expect(printed).toHaveLength(1);
    const bad = await call('reportSavePdf', { html: 5, suggestedName: 'x' });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.error.message).toBe('html: must be text');
  });

  it('reports a full disk in words and keeps the file', async () => {
    const file = join(dir, 'study.droopline.json');
    writeFileSync(file, projectText({ name: 'Kept' }));
    h.handles.clear();
    const full = setupFiles({
      userDataDir: userData,
      documentsDir: dir,
      isTrusted: () => true,
      window: () => null,
      steps: {
        ...(await import('../../electron/files/atomic-write')).nodeSaveSteps,
        writeNew: async () => {
          throw Object.assign(new Error('ENOSPC: no space left on device'), { code: 'ENOSPC' });
        },
      },
    });
    full.offer(file);
    await value('fileOpenPath', { path: file });
    const r = await call('fileSave', { path: file, text: projectText() });
    expect(!r.ok && r.error).toEqual({
      name: 'HostError',
      code: 'WRITE_FAILED',
      message: 'The disk is full: "study.droopline.json" was not saved. The file on disk was not changed.',
    });
    expect(readFileSync(file, 'utf8')).toBe(projectText({ name: 'Kept' }));
  });

  it('keeps a recovery copy that the next start finds, until it is discarded', async () => {
    expect(await value('recoveryRead')).toBeNull();
    const text = projectText({ name: 'Unsaved work' });
    expect(await value('recoveryWrite', { projectName: 'Unsaved work', path: null, fileName: null, text })).toEqual({ savedAt: '2026-12-02T03:00:00.000Z' });
    // The process is killed here; the next start is a new service over the same user-data folder.
    service = start();
    expect(await value('recoveryRead')).toEqual({ savedAt: '2026-12-02T03:00:00.000Z', projectName: 'Unsaved work', path: null, fileName: null, text });
    await value('recoveryDiscard');
    expect(await value('recoveryRead')).toBeNull();
  });

  it('lists a file as recent once it opened or saved cleanly, newest first', async () => {
    const a = join(dir, 'a.json');
    const b = join(dir, 'b.json');
    writeFileSync(a, '{}');
    writeFileSync(b, '{}');
    // Both were opened in this window (command line), so the window may name them.
    for (const f of [a, b]) {
      service.offer(f);
      await value('fileOpenPath', { path: f });
    }
    await value('documentState', { projectName: 'A', fileName: 'a.json', path: a, dirty: false });
    await value('documentState', { projectName: 'A', fileName: 'a.json', path: a, dirty: true });
    await value('documentState', { projectName: 'B', fileName: 'b.json', path: b, dirty: false });
    await value('documentState', { projectName: 'A', fileName: 'a.json', path: a, dirty: false });
    rmSync(b);
    const list = await value<{ path: string; projectName: string; missing: boolean }[]>('recentList');
    expect(list.map((f) => [f.projectName, f.missing])).toEqual([
      ['A', false],
      ['B', true],
    ]);
    expect(recentSeen).toHaveLength(3);
    expect(win.setDocumentEdited).toHaveBeenLastCalledWith(false);
    expect(await value('recentClear')).toEqual([]);
    expect(await value('recentList')).toEqual([]);
  });

  it('closes at once without unsaved changes', () => {
    service.guardClose(win as never);
    expect(win.close()).toBe(true);
    expect(h.dialog.showMessageBox).not.toHaveBeenCalled();
  });

  it('asks before closing with unsaved changes: Cancel keeps the window', async () => {
    service.guardClose(win as never);
    await value('documentState', { projectName: 'Study', fileName: 'study.json', path: null, dirty: true });
    h.dialog.showMessageBox.mockResolvedValue({ response: 2 });
    expect(win.close()).toBe(false);
    await vi.waitFor(() => expect(h.dialog.showMessageBox).toHaveBeenCalledOnce());
    expect(h.dialog.showMessageBox.mock.calls[0]![1].message).toBe('Save the changes to "study.json" before closing?');
    await new Promise((r) => setTimeout(r, 0));
    expect(win.closed).toBe(0);
    expect(win.webContents.send).not.toHaveBeenCalled();
  });

  it('"Save" asks the renderer to save and close; the renderer then closes the window', async () => {
    service.guardClose(win as never);
    await value('documentState', { projectName: 'Study', fileName: null, path: null, dirty: true });
    h.dialog.showMessageBox.mockResolvedValue({ response: 0 });
    win.close();
    await vi.waitFor(() => expect(win.webContents.send).toHaveBeenCalledWith('hostCommand', { command: 'save-and-close' }));
    expect(win.closed).toBe(0);
    await value('windowClose');
    expect(win.closed).toBe(1);
  });

  it('"Don\'t save" removes the recovery copy and closes', async () => {
    service.guardClose(win as never);
    await value('recoveryWrite', { projectName: 'Study', path: null, fileName: null, text: projectText() });
    await value('documentState', { projectName: 'Study', fileName: null, path: null, dirty: true });
    h.dialog.showMessageBox.mockResolvedValue({ response: 1 });
    win.close();
    await vi.waitFor(() => expect(win.closed).toBe(1));
    expect(await value('recoveryRead')).toBeNull();
  });

  it('pushes menu commands and command-line files to the renderer', () => {
    service.command({ command: 'save-as' });
    service.openPath('/plants/site.json');
    expect(win.webContents.send.mock.calls).toEqual([
      ['hostCommand', { command: 'save-as' }],
      ['hostCommand', { command: 'open-path', path: '/plants/site.json' }],
    ]);
  });

  it('finds the file on a command line and makes safe file names', () => {
    expect(fileFromArgv(['/opt/Droopline/droopline', '--no-sandbox', '/home/u/site.droopline.json'])).toBe('/home/u/site.droopline.json');
    expect(fileFromArgv(['/opt/Droopline/droopline', '.'])).toBeNull();
    // A relative name is the launching shell's file, made absolute against its folder.
    expect(fileFromArgv(['/opt/Droopline/droopline', 'plants/site.json'], '/home/u')).toBe('/home/u/plants/site.json');
    expect(fileNameFor('  ')).toBe('Untitled project.droopline.json');
    expect(fileNameFor('Works: <north>')).toBe('Works north.droopline.json');
    expect(fileNameFor('site.json')).toBe('site.json');
  });
});
