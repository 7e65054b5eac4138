/**
 * The project store end to end in-process: the store, the Electron host client over a
 * fake preload bridge, the real main-side file service (Electron mocked) writing to a
 * temporary folder, and the engine's handler table.
 */
import { describe, it, expect, vi, beforeEach, afterEach } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { HostBridge, HostCommand, Plant } from '../../shared-types';
import { setHostClient } from '../../renderer/host';
import { createElectronHost } from '../../renderer/host/electron-host';
import { useProjectStore } from '../../renderer/stores/project';
import { usePlantStore } from '../../renderer/stores/plant';
import { useUiStore } from '../../renderer/stores/ui';
import { useSyncStore } from '../../renderer/stores/sync';
import { useTrainerStore } from '../../renderer/stores/trainer';
import { useTransientsStore } from '../../renderer/stores/transients';
import { useCommissioningStore } from '../../renderer/stores/commissioning';
import { parseProject, serializeProject } from '../../electron/project';
import { freshStores } from './view-harness';
import { demoPlantJson } from '../helpers/plants';
import { projectText } from '../helpers/projects';

const h = vi.hoisted(() => {
  const handles = new Map<string, (...args: unknown[]) => unknown>();
  const dialog = { showOpenDialog: vi.fn(), showSaveDialog: vi.fn(), showMessageBox: vi.fn() };
  const commandListeners: ((c: unknown) => void)[] = [];
  const win = {
    closed: 0,
    webContents: { send: (_ch: string, c: unknown) => commandListeners.forEach((l) => l(c)) },
    setDocumentEdited: vi.fn(),
    setRepresentedFilename: vi.fn(),
    isDestroyed: () => false,
    on: () => undefined,
    close() {
      this.closed++;
    },
  };
  return { handles, dialog, commandListeners, win };
});

vi.mock('electron', () => ({
  ipcMain: { handle: (ch: string, fn: (...a: unknown[]) => unknown) => h.handles.set(ch, fn) },
  dialog: h.dialog,
}));

const { setupFiles } = await import('../../electron/files/setup-files');

let dir: string;
const me = {};
/** Every store of the test, disposed after it so no watcher or autosave timer outlives the test. */
let sessions: ReturnType<typeof useProjectStore>[] = [];
/** The main-side file service of the current session. */
let files: ReturnType<typeof setupFiles>;

/** A fresh app session: new stores, a new main-side service over the same folders. */
function session(): ReturnType<typeof useProjectStore> {
  h.handles.clear();
  h.commandListeners.length = 0;
  files = setupFiles({ userDataDir: join(dir, 'user-data'), documentsDir: dir, isTrusted: (s) => s === me, window: () => h.win as never });
  const bridge: HostBridge = {
    invoke: (method, request) => h.handles.get(method)!({ sender: me }, JSON.parse(JSON.stringify(request))) as never,
    onCommand: (listener) => {
      h.commandListeners.push(listener as (c: unknown) => void);
      return () => undefined;
    },
    openDropped: () => Promise.resolve(null),
  };
  freshStores();
  setHostClient(createElectronHost(bridge));
  const project = useProjectStore();
  sessions.push(project);
  return project;
}

/** Opens `file` by path as the recent list or the command line would (main offers the path first). */
function openOffered(project: ReturnType<typeof useProjectStore>, file: string): Promise<boolean> {
  files.offer(file);
  return project.openPath(file);
}

/** An accepted change to the plant (as the plant editor makes one). */
async function editPlant(change: (p: Plant) => void): Promise<void> {
  const plants = usePlantStore();
  const next = structuredClone(plants.plant!) as Plant;
  change(next);
  expect(await plants.load(next, 'edit')).toBe(true);
}

function saveDialogAnswers(path: string | null): void {
  h.dialog.showSaveDialog.mockResolvedValue(path ? { canceled: false, filePath: path } : { canceled: true, filePath: '' });
}
function openDialogAnswers(path: string): void {
  h.dialog.showOpenDialog.mockResolvedValue({ canceled: false, filePaths: [path] });
}

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'droopline-project-'));
  vi.clearAllMocks();
  h.win.closed = 0;
});
afterEach(() => {
  for (const s of sessions) s.$dispose();
  sessions = [];
  setHostClient(undefined);
  rmSync(dir, { recursive: true, force: true });
});

describe('project store', () => {
  it('starts clean with the demo plant, titled by its name', async () => {
    const project = session();
    await project.start();
    expect(project.name).toBe('Kestrel Ford Water Treatment Works (demo)');
    expect(project.dirty).toBe(false);
    expect(project.title).toBe('Kestrel Ford Water Treatment Works (demo) — Droopline');
    expect(document.title).toBe(project.title);
    expect(project.recovery).toBeNull();
  });

  it('marks unsaved changes in the title and the window, and clears the mark when saved', async () => {
    const project = session();
    await project.start();
    await editPlant((p) => (p.sets[0]!.governor.droopPct = 5));
    expect(project.dirty).toBe(true);
    expect(project.title).toBe('● Kestrel Ford Water Treatment Works (demo) — Droopline');
    await vi.waitFor(() => expect(h.win.setDocumentEdited).toHaveBeenLastCalledWith(true));
    saveDialogAnswers(join(dir, 'works'));
    expect(await project.save()).toBe(true);
    expect(project.dirty).toBe(false);
    expect(project.fileName).toBe('works.droopline.json');
    expect(project.title).toBe('works.droopline.json — Droopline');
    expect(h.win.setDocumentEdited).toHaveBeenLastCalledWith(false);
  });

  it('round-trips: save, open the file again, identical project', async () => {
    const first = session();
    await first.start();
    await editPlant((p) => (p.sets[1]!.governor.noLoadHz = 51.35));
    useUiStore().show('synchronizing');
    saveDialogAnswers(join(dir, 'study.droopline.json'));
    await first.saveAs();
    const savedProject = first.current();
    const fileText = readFileSync(join(dir, 'study.droopline.json'), 'utf8');
    expect(parseProject(fileText).project).toEqual(savedProject);

    const second = session();
    await second.start();
    openDialogAnswers(join(dir, 'study.droopline.json'));
    expect(await second.open()).toBe(true);
    expect(second.current()).toEqual(savedProject);
    // The file is the engine's text of that project, checksum included.
    expect(serializeProject(second.current()!)).toBe(fileText);
    expect(parseProject(fileText).notes).toEqual([]);
    expect(useUiStore().view).toBe('synchronizing');
    expect(second.dirty).toBe(false);
    expect(second.recent.map((r) => r.fileName)).toEqual(['study.droopline.json']);
  });

  it('keeps scenarios, sync settings and the trainer log through open and save', async () => {
    const file = join(dir, 'full.droopline.json');
    writeFileSync(file, projectText());
    const project = session();
    await project.start();
    expect(await openOffered(project, file)).toBe(true);
    await editPlant((p) => (p.loads[0]!.kW += 10));
    await project.save();
    const again = parseProject(readFileSync(file, 'utf8')).project;
    const before = parseProject(projectText()).project;
    expect(again.scenarios).toEqual(before.scenarios);
    expect(again.sync).toEqual(before.sync);
    expect(again.trainerLog).toEqual(before.trainerLog);
    expect(again.plant.loads[0]!.kW).toBe(before.plant.loads[0]!.kW + 10);
    expect(readFileSync(`${file}.bak`, 'utf8')).toBe(projectText());
  });

  it('counts edits in the sync, transients and trainer stores as changes and saves them', async () => {
    const file = join(dir, 'parts.droopline.json');
    writeFileSync(file, projectText());
    const project = session();
    await project.start();
    expect(await openOffered(project, file), project.notice?.text).toBe(true);
    expect(useTransientsStore().scenarios.map((s) => s.name)).toEqual(['Pump start at 2 s']);
    expect(useTrainerStore().attempts).toHaveLength(1);
    useSyncStore().setBreakerClosingMs(95);
    expect(project.dirty).toBe(true);
    await project.save();
    expect(parseProject(readFileSync(file, 'utf8')).project.sync?.breakerClosingMs).toBe(95);
    useTrainerStore().clearLog();
    useTransientsStore().removeScenario('S1');
    expect(project.dirty).toBe(true);
    await project.save();
    const saved = parseProject(readFileSync(file, 'utf8')).project;
    expect(saved.trainerLog).toEqual([]);
    expect(saved.scenarios).toEqual([]);
    // An instructor's exercise set is a change and is saved with the project.
    const setId = useTrainerStore().addExerciseSet('Week 1');
    expect(project.dirty).toBe(true);
    await project.save();
    const withSet = parseProject(readFileSync(file, 'utf8')).project;
    expect(withSet.trainerExercises.map((x) => x.id)).toEqual([setId]);
    expect(withSet.trainerExercises[0]!.exercises).toHaveLength(1);
  });

  it('keeps the commissioning work through save and open: the record with its choices, the test, the fit, the sign-off', { timeout: 60_000 }, async () => {
    const first = session();
    await first.start();
    const work = useCommissioningStore();
    // A new view's state is no work: the project has no section, and the view's own defaults change nothing.
    expect(work.snapshot()).toBeNull();
    work.recordSetId = 'G1';
    work.signOff.date = '2026-12-02';
    expect(first.dirty).toBe(false);
    await work.openExample();
    await vi.waitFor(() => expect(work.preview).not.toBeNull());
    work.acceptImport();
    expect(first.dirty).toBe(true);
    work.test.stepKVAR = '' as unknown as number; // a blank entry, as a cleared number field gives it
    for (const p of work.params) p.chosen = p.key === 'machine.inertiaS';
    work.maxIterations = 1;
    work.test.stepKVAR = 300;
    await work.runFit();
    expect(work.fitState, work.fitError ?? '').toBe('done');
    work.test.stepKVAR = '' as unknown as number;
    work.signOff.by = 'R. Tester';
    saveDialogAnswers(join(dir, 'bank.droopline.json'));
    expect(await first.saveAs()).toBe(true);
    const saved = parseProject(readFileSync(join(dir, 'bank.droopline.json'), 'utf8'));
    expect(saved.notes).toEqual([]);
    const c = saved.project.commissioning!;
    expect(c.record!.fileName).toBe('example.load-bank.csv');
    expect(c.record!.text).toBe(readFileSync('renderer/demo/example.load-bank.csv', 'utf8'));
    expect(c.record!.columns).toMatchObject({ time: 'time_s', frequency: 'frequency_Hz', voltage: 'voltage_V' });
    expect(c.test).toMatchObject({ setId: 'G1', stepAtS: 2.01, stepKVAR: null });
    expect(c.fit!.test.stepKVAR).toBe(300);
    expect(c.signOff).toEqual({ by: 'R. Tester', date: '2026-12-02', remarks: '' });
    const fitBefore = JSON.parse(JSON.stringify(work.fit)) as unknown;

    const second = session();
    await second.start();
    const fresh = useCommissioningStore();
    expect(fresh.snapshot()).toBeNull();
    openDialogAnswers(join(dir, 'bank.droopline.json'));
    expect(await second.open(), second.notice?.text).toBe(true);
    expect(second.current()).toEqual(saved.project);
    expect(second.dirty).toBe(false);
    expect(fresh.fit).toEqual(fitBefore);
    expect(fresh.fitState).toBe('done');
    expect(fresh.test.stepKVAR).toBeNaN();
    expect(fresh.params.filter((p) => p.chosen).map((p) => p.key)).toEqual(['machine.inertiaS']);
    expect(fresh.signOff.by).toBe('R. Tester');
    // The record is read again with its choices, so the fit may run again at once.
    await vi.waitFor(() => expect(fresh.parsed?.rows).toBe(401));
    expect(fresh.restoreError).toBeNull();
    fresh.test.stepKVAR = 300;
    expect(fresh.fitProblems).toEqual([]);
    expect(second.dirty).toBe(true);

    // A project without commissioning work puts the view back to its new state.
    const plain = join(dir, 'plain.droopline.json');
    writeFileSync(plain, projectText());
    await second.save();
    expect(await openOffered(second, plain)).toBe(true);
    expect(fresh.snapshot()).toBeNull();
    expect(fresh.parsed).toBeNull();
    expect(fresh.fit).toBeNull();
    expect('commissioning' in second.current()!).toBe(false);
  });

  it('opens a version-1 plant file as a new, unsaved-to-file project; Save asks where', async () => {
    const plantFile = join(dir, 'site.plant.json');
    writeFileSync(plantFile, JSON.stringify(demoPlantJson()));
    const project = session();
    await project.start();
    expect(await openOffered(project, plantFile)).toBe(true);
    expect(project.path).toBeNull();
    expect(project.notice?.tone).toBe('info');
    expect(project.notice?.text).toContain('This was a plant file');
    saveDialogAnswers(join(dir, 'site project'));
    expect(await project.save()).toBe(true);
    expect(h.dialog.showSaveDialog).toHaveBeenCalledOnce();
    expect(readFileSync(plantFile, 'utf8')).toBe(JSON.stringify(demoPlantJson()));
    expect(parseProject(readFileSync(join(dir, 'site project.droopline.json'), 'utf8')).migratedFrom).toBeNull();
  });

  it('refuses a truncated file with a clear message, keeps the current project and offers the backup', async () => {
    const file = join(dir, 'cut.droopline.json');
    const full = projectText({ name: 'Backed up' });
    writeFileSync(file, full.slice(0, 300));
    writeFileSync(`${file}.bak`, full);
    const project = session();
    await project.start();
    const before = project.text();
    expect(await openOffered(project, file)).toBe(false);
    expect(project.notice?.tone).toBe('error');
    expect(project.notice?.text).toMatch(/^Could not open "cut.droopline.json". The file stops in the middle of the project \(line \d+, column \d+/);
    expect(project.text()).toBe(before);
    expect(readFileSync(file, 'utf8')).toBe(full.slice(0, 300));
    expect(project.backupOffer).toBe(`${file}.bak`);
    expect(await project.openPath(project.backupOffer!)).toBe(true);
    expect(project.name).toBe('Backed up');
    // A backup opens as a new project: Save must not write over the .bak.
    expect(project.path).toBeNull();
  });

  it('refuses a file from a newer version, saying so', async () => {
    const file = join(dir, 'future.droopline.json');
    writeFileSync(file, projectText({ version: 7 }));
    const project = session();
    await project.start();
    expect(await openOffered(project, file)).toBe(false);
    expect(project.notice?.text).toBe(
      'Could not open "future.droopline.json". This project was saved by a newer version of Droopline (file version 7; this version reads up to 1). Open it with a newer Droopline. The file was not changed.',
    );
  });

  it('autosaves a recovery copy while edited; the next start offers it and restores the changes as unsaved', async () => {
    const first = session();
    await first.start();
    await editPlant((p) => (p.sets[2]!.ratedKW = 420));
    await first.flushAutosave();
    expect(existsSync(join(dir, 'user-data', 'recovery', 'recovery.json'))).toBe(true);
    expect(first.lastAutosaveAt).not.toBeNull();
    // Killed here: no save, no clean close. Next start:
    const second = session();
    await second.start();
    expect(second.recovery?.projectName).toBe('Kestrel Ford Water Treatment Works (demo)');
    expect(usePlantStore().plant!.sets[2]!.ratedKW).toBe(400);
    expect(await second.restoreRecovery()).toBe(true);
    // The copy stays on disk until the restored changes are saved.
    await new Promise((r) => setTimeout(r, 20));
    expect(existsSync(join(dir, 'user-data', 'recovery', 'recovery.json'))).toBe(true);
    expect(usePlantStore().plant!.sets[2]!.ratedKW).toBe(420);
    expect(second.dirty).toBe(true);
    expect(second.recovery).toBeNull();
    expect(second.notice?.text).toContain('Restored the unsaved changes');
  });

  it('does not overwrite the recovery copy before the user answers, and forgets it on "discard"', async () => {
    const first = session();
    await first.start();
    await editPlant((p) => (p.sets[0]!.ratedKW = 990));
    await first.flushAutosave();
    const copy = readFileSync(join(dir, 'user-data', 'recovery', 'recovery.json'), 'utf8');
    const second = session();
    await second.start();
    await editPlant((p) => (p.sets[0]!.ratedKW = 900));
    await second.flushAutosave();
    expect(readFileSync(join(dir, 'user-data', 'recovery', 'recovery.json'), 'utf8')).toBe(copy);
    await second.discardRecovery();
    expect(existsSync(join(dir, 'user-data', 'recovery', 'recovery.json'))).toBe(false);
    const third = session();
    await third.start();
    expect(third.recovery).toBeNull();
  });

  it('removes the recovery copy once the project is saved', async () => {
    const project = session();
    await project.start();
    await editPlant((p) => (p.sets[0]!.ratedKW = 990));
    await project.flushAutosave();
    saveDialogAnswers(join(dir, 'saved.json'));
    await project.save();
    expect(existsSync(join(dir, 'user-data', 'recovery', 'recovery.json'))).toBe(false);
  });

  it('asks before replacing unsaved changes: Cancel keeps them, "Don\'t save" goes on', async () => {
    const file = join(dir, 'other.droopline.json');
    writeFileSync(file, projectText({ name: 'Other' }));
    const project = session();
    await project.start();
    await editPlant((p) => (p.sets[0]!.ratedKW = 990));
    const cancelled = openOffered(project, file);
    await vi.waitFor(() => expect(project.question?.action).toBe('open another project'));
    project.question!.answer('cancel');
    expect(await cancelled).toBe(false);
    expect(project.dirty).toBe(true);
    const discarded = openOffered(project, file);
    await vi.waitFor(() => expect(project.question).not.toBeNull());
    project.question!.answer('discard');
    expect(await discarded).toBe(true);
    expect(project.name).toBe('Other');
    expect(project.dirty).toBe(false);
  });

  it('runs menu commands; "save and close" saves and then closes the window', async () => {
    const file = join(dir, 'menu.droopline.json');
    writeFileSync(file, projectText());
    const project = session();
    await project.start();
    files.openPath(file); // a file named on the command line
    await vi.waitFor(() => expect(project.fileName).toBe('menu.droopline.json'));
    await editPlant((p) => (p.sets[0]!.ratedKW = 990));
    h.win.webContents.send('hostCommand', { command: 'save-and-close' } satisfies HostCommand);
    await vi.waitFor(() => expect(h.win.closed).toBe(1));
    expect(parseProject(readFileSync(file, 'utf8')).project.plant.sets[0]!.ratedKW).toBe(990);
  });

  it('starts a new project from the one-set template', async () => {
    const project = session();
    await project.start();
    expect(await project.newProject()).toBe(true);
    expect(project.name).toBe('Untitled project');
    expect(usePlantStore().plant!.sets.map((s) => s.id)).toEqual(['G1']);
    expect(project.path).toBeNull();
    expect(project.dirty).toBe(false);
  });
});
