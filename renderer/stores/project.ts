/**
 * The project store: the one place in the renderer that knows the project file. It
 * composes the file from the stores that own its parts (plant, scenarios, sync settings,
 * trainer log, commissioning work, view settings), opens files through the host (Electron's file service or
 * the browser preview's own), tracks unsaved changes, keeps a recovery copy a moment after
 * each edit, and offers to restore that copy after a crash.
 */
import { defineStore } from 'pinia';
import { computed, ref, shallowRef, watch } from 'vue';
import { PROJECT_FORMAT, PROJECT_VERSION } from '../../shared-types';
import type { HostCommand, Project, RecentFile, RecoveryCopy } from '../../shared-types';
import newPlant from '../demo/new-project.plant.json';
import { host } from '../host';
import { engine, messageOf } from '../transport';
import { usePlantStore } from './plant';
import { useAutosave } from './project-autosave';
import { projectParts } from './project-parts';
import { starterScenarios } from './transients-rules';
import type { PartKey } from './project-parts';
import { VIEWS, useUiStore } from './ui';
import type { ViewId } from './ui';

export { AUTOSAVE_DELAY_MS } from './project-autosave';
/** Name of a project that has none yet. */
export const UNTITLED = 'Untitled project';

/** A line for the user about the last file action. */
export interface ProjectNotice {
  tone: 'ok' | 'info' | 'error';
  text: string;
}

/** The question asked before unsaved changes would be replaced. */
export interface UnsavedQuestion {
  /** What the user was about to do ("open another project"). */
  action: string;
  answer(choice: 'save' | 'discard' | 'cancel'): void;
}

/** Where an opened text came from. */
interface Origin {
  path: string | null;
  fileName: string | null;
  backupPath?: string | null;
}

type Held = Pick<Project, PartKey | 'view'>;
/** Every part's key (a part added to `PartKey` and not here fails to compile: its changes must count as unsaved). */
const PART_KEYS = Object.keys({ scenarios: 1, sync: 1, trainerLog: 1, trainerExercises: 1, commissioning: 1 } satisfies Record<PartKey, 1>) as PartKey[];
const EMPTY_PARTS: Held = { scenarios: [], sync: null, trainerLog: [], trainerExercises: [], commissioning: null, view: {} };

export const useProjectStore = defineStore('project', () => {
  const plantStore = usePlantStore();
  const ui = useUiStore();
  const parts = projectParts();

  const name = ref(UNTITLED);
  /** Where Save writes (null: never saved, or the host cannot write back). */
  const path = ref<string | null>(null);
  const fileName = ref<string | null>(null);
  /** Parts kept as the file had them (for parts without an owning store) and view settings. */
  const held = shallowRef<Held>(EMPTY_PARTS);
  /** The content at the last open or save; null before the first project is in place. */
  const baseline = ref<string | null>(null);
  const notice = ref<ProjectNotice | null>(null);
  /** A backup the user may open after the file itself failed to open. */
  const backupOffer = ref<string | null>(null);
  const busy = ref(false);
  const recovery = shallowRef<RecoveryCopy | null>(null);
  const recent = ref<RecentFile[]>([]);
  const question = shallowRef<UnsavedQuestion | null>(null);
  /** The recovery question is answered (or there was none): autosave may now replace the copy. */
  const recoveryResolved = ref(false);
  let started = false;
  /** Settles when `start()` has put the first project in place; file actions wait for it. */
  let ready: Promise<void> = Promise.resolve();

  function part<K extends PartKey>(key: K): Project[K] {
    const owner = parts[key];
    return owner ? owner.snapshot() : (held.value[key] as Project[K]);
  }

  /** The project as it would be saved now, or null while there is no valid plant. */
  function current(): Project | null {
    const plant = plantStore.plant;
    if (!plant) return null;
    const commissioning = part('commissioning');
    return {
      format: PROJECT_FORMAT,
      version: PROJECT_VERSION,
      name: name.value,
      plant,
      scenarios: part('scenarios'),
      sync: part('sync'),
      trainerLog: part('trainerLog'),
      trainerExercises: part('trainerExercises'),
      // Written only once there is commissioning work (files without it open as before).
      ...(commissioning ? { commissioning } : {}),
      view: { ...held.value.view, view: ui.view },
    };
  }

  /**
   * The project's text for the recovery copy (JSON, two-space indent, final newline). Saved
   * files are written by the engine's `serializeProject`, which adds the content checksum.
   */
  function text(): string | null {
    const p = current();
    return p ? `${JSON.stringify(p, null, 2)}\n` : null;
  }

  /**
   * Each part's text on its own, so a plant edit does not write out the scenarios, the sync settings, the trainer's
   * log and exercises or the commissioning record again (only the part that changed is).
   */
  const partTexts = PART_KEYS.map((key) => computed(() => JSON.stringify(part(key)) ?? 'null'));
  /**
   * What counts as a change: the name, the plant and the parts; not the view settings (moving between views is not an
   * edit). Compared with the text at the last open or save, so undoing back to it reads as unchanged.
   */
  const content = computed(() => {
    const plant = plantStore.plant;
    if (!plant) return null;
    return [JSON.stringify(name.value), JSON.stringify(plant), ...partTexts.map((t) => t.value)].join('\n');
  });

  const dirty = computed(() => content.value !== null && baseline.value !== null && content.value !== baseline.value);
  const displayName = computed(() => fileName.value ?? name.value);
  /** The window title: a mark and the words "unsaved changes" are not possible there, so a dot leads. */
  const title = computed(() => `${dirty.value ? '● ' : ''}${displayName.value} — Droopline`);

  function markClean(): void {
    baseline.value = content.value;
  }

  async function pushDocumentState(): Promise<void> {
    try {
      await host().call('documentState', { projectName: name.value, fileName: fileName.value, path: path.value, dirty: dirty.value });
      if (!dirty.value) recent.value = await host().call('recentList', {});
    } catch {
      // The window title and recent list are conveniences; the project is unaffected.
    }
  }

  /** Asks before replacing unsaved changes; true when the caller may go on. */
  async function mayReplace(action: string): Promise<boolean> {
    if (!dirty.value) return true;
    const choice = await new Promise<'save' | 'discard' | 'cancel'>((resolve) => {
      question.value = { action, answer: resolve };
    });
    question.value = null;
    if (choice === 'cancel') return false;
    if (choice === 'save') return save();
    return true;
  }

  /** Puts a parsed project in place; the current one stays if the plant is refused. */
  async function install(project: Project, origin: Origin, keepPath: boolean): Promise<boolean> {
    const label = origin.fileName ?? project.name;
    const before = baseline.value;
    // No "unsaved changes" while the parts change one by one.
    baseline.value = null;
    if (!(await plantStore.load(project.plant, label))) {
      baseline.value = before;
      notice.value = { tone: 'error', text: `Could not open "${label}": ${plantStore.error ?? 'the plant was refused'}` };
      return false;
    }
    for (const key of ['scenarios', 'sync', 'trainerLog', 'trainerExercises', 'commissioning'] as const) {
      (parts[key] as { restore(v: unknown): void } | undefined)?.restore(project[key]);
    }
    held.value = {
      scenarios: project.scenarios,
      sync: project.sync,
      trainerLog: project.trainerLog,
      trainerExercises: project.trainerExercises,
      commissioning: project.commissioning ?? null,
      view: project.view,
    };
    const view = project.view.view;
    if (typeof view === 'string' && VIEWS.some((v) => v.id === view)) ui.show(view as ViewId);
    name.value = project.name;
    path.value = keepPath ? origin.path : null;
    fileName.value = keepPath ? origin.fileName : null;
    markClean();
    return true;
  }

  /**
   * Opens a project from its text. A damaged, foreign or newer file leaves the current
   * project as it was and says why; a backup beside it is offered.
   */
  async function openText(textIn: string, origin: Origin): Promise<boolean> {
    await ready;
    const label = origin.fileName ?? 'the file';
    backupOffer.value = null;
    let parsed;
    try {
      parsed = await engine().call('parseProject', { text: textIn });
    } catch (e) {
      notice.value = { tone: 'error', text: `Could not open "${label}". ${messageOf(e)}` };
      backupOffer.value = origin.backupPath ?? null;
      return false;
    }
    // Older project files save back in place; a plant, scenario or case file becomes a new project (Save As),
    // and so does a backup (saving over the .bak would lose the copy the user came back for).
    const isBackup = origin.path?.toLowerCase().endsWith('.bak') ?? false;
    const keepPath = !isBackup && (parsed.migratedFrom === null || parsed.migratedFrom.startsWith('a project file'));
    if (!(await install(parsed.project, origin, keepPath))) return false;
    notice.value = parsed.notes.length ? { tone: 'info', text: `Opened "${label}". ${parsed.notes.join(' ')}` } : { tone: 'ok', text: `Opened "${label}".` };
    await pushDocumentState();
    return true;
  }

  async function guarded<T>(work: () => Promise<T>, failure: T): Promise<T> {
    busy.value = true;
    try {
      return await work();
    } catch (e) {
      notice.value = { tone: 'error', text: messageOf(e) };
      return failure;
    } finally {
      busy.value = false;
    }
  }

  /** Shows the open dialog (or the browser's picker) and opens the chosen file. */
  async function open(): Promise<boolean> {
    if (!(await mayReplace('open another project'))) return false;
    return guarded(async () => {
      const file = await host().call('fileOpenDialog', {});
      return file ? openText(file.text, file) : false;
    }, false);
  }

  /** Opens a file by path (recent list, command line, the backup offered after a failure). */
  async function openPath(filePath: string): Promise<boolean> {
    if (!(await mayReplace('open another project'))) return false;
    return guarded(async () => {
      const file = await host().call('fileOpenPath', { path: filePath });
      return openText(file.text, file);
    }, false);
  }

  /** Opens a file dropped on the window. */
  async function openDropped(file: File): Promise<boolean> {
    if (!(await mayReplace('open the dropped file'))) return false;
    return guarded(async () => {
      const opened = await host().openDropped(file);
      return opened ? openText(opened.text, opened) : openText(await file.text(), { path: null, fileName: file.name });
    }, false);
  }

  async function verified(): Promise<string | null> {
    const p = current();
    if (p === null) {
      notice.value = { tone: 'error', text: 'There is no valid plant to save yet.' };
      return null;
    }
    // The engine writes the file text (with its checksum), and it must open again: check it
    // with the same reader before it reaches the disk.
    const { text: t } = await engine().call('serializeProject', { project: p });
    await engine().call('parseProject', { text: t });
    return t;
  }

  function savedNotice(file: { fileName: string; savedAt: string; backupFileName: string | null }, downloaded: boolean): void {
    const at = new Date(file.savedAt).toLocaleTimeString();
    const where = downloaded ? `Downloaded "${file.fileName}"` : `Saved "${file.fileName}" at ${at}`;
    const kept = file.backupFileName ? `${where}; the previous version is kept as "${file.backupFileName}".` : `${where}.`;
    // The plant editor may hold a draft with problems: the file has the last valid plant, and says so.
    notice.value = plantStore.draftInvalid
      ? { tone: 'info', text: `${kept} The plant editor has problems still to fix; the file holds the last valid plant.` }
      : { tone: 'ok', text: kept };
  }

  async function afterSave(savedContent: string | null, file: { path: string | null; fileName: string }): Promise<void> {
    path.value = file.path;
    fileName.value = file.fileName;
    baseline.value = savedContent;
    if (!dirty.value) plantStore.markSaved();
    if (!dirty.value)
      await host()
        .call('recoveryDiscard', {})
        .catch(() => null);
    await pushDocumentState();
  }

  /** Saves to the current file, or asks where (Save As). True when the project was saved. */
  async function save(): Promise<boolean> {
    await ready;
    if (!path.value) return saveAs();
    const target = path.value;
    return guarded(async () => {
      const savedContent = content.value;
      const t = await verified();
      if (t === null) return false;
      const file = await host().call('fileSave', { path: target, text: t });
      await afterSave(savedContent, file);
      savedNotice(file, false);
      return true;
    }, false);
  }

  /** Asks where to save and saves there (the browser preview downloads without a picker). */
  async function saveAs(): Promise<boolean> {
    await ready;
    return guarded(async () => {
      const savedContent = content.value;
      const t = await verified();
      if (t === null) return false;
      const file = await host().call('fileSaveAs', { suggestedName: name.value, text: t });
      if (!file) return false;
      await afterSave(savedContent, file);
      savedNotice(file, file.path === null);
      return true;
    }, false);
  }

  /** Starts a new project from a one-set template plant. */
  async function newProject(): Promise<boolean> {
    await ready;
    if (!(await mayReplace('start a new project'))) return false;
    const plant = structuredClone(newPlant) as unknown as Project['plant'];
    // The starter scenarios are part of the new project from the start, so opening Transients changes nothing.
    const project: Project = { format: PROJECT_FORMAT, version: PROJECT_VERSION, name: UNTITLED, plant, ...EMPTY_PARTS, scenarios: starterScenarios(plant) };
    const ok = await install(project, { path: null, fileName: null }, false);
    if (ok) {
      notice.value = { tone: 'info', text: 'New project with one set: edit the plant, then save.' };
      await pushDocumentState();
    }
    return ok;
  }

  /** Renames the project (the name saved in the file, not the file name). */
  function rename(next: string): void {
    const trimmed = next.trim();
    if (trimmed) name.value = trimmed;
  }

  /** Restores the recovery copy: its changes come back, still unsaved. */
  async function restoreRecovery(): Promise<boolean> {
    const copy = recovery.value;
    if (!copy) return false;
    return guarded(async () => {
      const ok = await openText(copy.text, { path: copy.path, fileName: copy.fileName });
      if (!ok) return false;
      recovery.value = null;
      recoveryResolved.value = true;
      // The file on disk does not hold these changes: the project is dirty until saved.
      baseline.value = '';
      notice.value = {
        tone: 'info',
        text: `Restored the unsaved changes to "${copy.fileName ?? copy.projectName}" from ${new Date(copy.savedAt).toLocaleString()}. Save to keep them.`,
      };
      await pushDocumentState();
      return true;
    }, false);
  }

  /** Forgets the recovery copy. */
  async function discardRecovery(): Promise<void> {
    recovery.value = null;
    recoveryResolved.value = true;
    await host()
      .call('recoveryDiscard', {})
      .catch(() => null);
  }

  async function runCommand(c: HostCommand): Promise<void> {
    if (c.command === 'new') await newProject();
    else if (c.command === 'open') await open();
    else if (c.command === 'save') await save();
    else if (c.command === 'save-as') await saveAs();
    else if (c.command === 'open-path') await openPath(c.path);
    else if (c.command === 'save-and-close') {
      if (await save())
        await host()
          .call('windowClose', {})
          .catch(() => null);
    }
  }

  const { lastAutosaveAt, flushAutosave } = useAutosave({
    content,
    dirty,
    enabled: recoveryResolved,
    settled: () => started && baseline.value !== null,
    copy: () => {
      const t = text();
      return t === null ? null : { projectName: name.value, path: path.value, fileName: fileName.value, text: t };
    },
    onError: (message) => (notice.value = { tone: 'error', text: message }),
  });
  watch(dirty, () => void pushDocumentState());
  watch(title, (t) => {
    if (typeof document !== 'undefined') document.title = t;
  });

  /**
   * Starts the project side of the app: listens to menu commands, puts the demo plant in
   * place as an unsaved project when nothing is loaded, reads the recent list and looks
   * for a recovery copy left by a session that ended with unsaved changes.
   */
  function start(): Promise<void> {
    if (started) return ready;
    started = true;
    ready = startOnce();
    return ready;
  }

  async function startOnce(): Promise<void> {
    host().onCommand((c) => void runCommand(c));
    if (!plantStore.plant) await plantStore.loadDemo();
    if (plantStore.plant && baseline.value === null) {
      name.value = plantStore.plant.name;
      // The demo project carries its starter scenarios from the start (opening a view never changes the project).
      if (part('scenarios').length === 0) parts.scenarios?.restore(starterScenarios(plantStore.plant));
      markClean();
    }
    if (typeof document !== 'undefined') document.title = title.value;
    try {
      recent.value = await host().call('recentList', {});
      recovery.value = await host().call('recoveryRead', {});
    } catch (e) {
      notice.value = { tone: 'error', text: messageOf(e) };
    }
    if (!recovery.value) recoveryResolved.value = true;
  }

  return {
    name,
    path,
    fileName,
    displayName,
    dirty,
    title,
    notice,
    backupOffer,
    busy,
    recovery,
    recent,
    question,
    lastAutosaveAt,
    current,
    text,
    start,
    open,
    openPath,
    openDropped,
    openText,
    save,
    saveAs,
    newProject,
    rename,
    restoreRecovery,
    discardRecovery,
    runCommand,
    flushAutosave,
  };
});
