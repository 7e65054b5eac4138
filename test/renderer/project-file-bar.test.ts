import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import type { HostMethod, HostRequest, HostResponse, RecentFile, RecoveryCopy } from '../../shared-types';
import FileBar from '../../renderer/components/project/FileBar.vue';
import ProjectDialogs from '../../renderer/components/project/ProjectDialogs.vue';
import ProjectNotice from '../../renderer/components/project/ProjectNotice.vue';
import { setHostClient } from '../../renderer/host';
import type { HostClient } from '../../renderer/host';
import { useProjectStore } from '../../renderer/stores/project';
import { usePlantStore } from '../../renderer/stores/plant';
import { freshStores } from './view-harness';
import { projectText } from '../helpers/projects';

/** A host in memory: answers from fixed data and records the calls. */
function memoryHost(state: { recovery: RecoveryCopy | null; recent: RecentFile[] }): HostClient & { calls: string[] } {
  const calls: string[] = [];
  const answers: { [K in HostMethod]?: (r: HostRequest<K>) => HostResponse<K> } = {
    recentList: () => state.recent,
    recoveryRead: () => state.recovery,
    recoveryDiscard: () => {
      state.recovery = null;
      return null;
    },
    recoveryWrite: () => ({ savedAt: '2026-12-02T03:00:00.000Z' }),
    documentState: () => null,
    fileOpenPath: ({ path }) => ({ path, fileName: path.split('/').at(-1)!, text: projectText({ name: 'From recent' }), backupPath: null }),
  };
  return {
    kind: 'electron',
    savesInPlace: true,
    calls,
    async call<K extends HostMethod>(method: K, request: HostRequest<K>) {
      calls.push(method);
      const answer = answers[method] as ((r: HostRequest<K>) => HostResponse<K>) | undefined;
      if (!answer) throw new Error(`unexpected host call ${method}`);
      return answer(request);
    },
    onCommand: () => () => undefined,
    openDropped: () => Promise.resolve(null),
  };
}

const recovery: RecoveryCopy = {
  savedAt: '2026-12-01T22:40:00.000Z',
  projectName: 'Night shift study',
  path: '/plants/night.droopline.json',
  fileName: 'night.droopline.json',
  text: projectText({ name: 'Night shift study' }),
};

describe('project file bar and dialogs', () => {
  beforeEach(() => {
    freshStores();
  });
  afterEach(() => {
    useProjectStore().$dispose();
    setHostClient(undefined);
  });

  it('shows the project name and its state in words, and renames the project', async () => {
    setHostClient(memoryHost({ recovery: null, recent: [] }));
    const project = useProjectStore();
    await project.start();
    const w = mount(FileBar);
    expect(w.get('[data-test="project-name"]').text()).toBe('Kestrel Ford Water Treatment Works (demo)');
    expect(w.get('[data-test="project-state"]').text()).toBe('○ not saved to a file');
    await w.get('[data-test="project-name"]').trigger('click');
    await w.get('[data-test="project-name-input"]').setValue('Pump station upgrade');
    await w.get('[data-test="project-name-input"]').trigger('keydown', { key: 'Enter' });
    expect(project.name).toBe('Pump station upgrade');
    expect(w.get('[data-test="project-state"]').text()).toBe('● unsaved changes');
  });

  it('lists recent files, marks missing ones, and opens one', async () => {
    const host = memoryHost({
      recovery: null,
      recent: [
        { path: '/plants/a.droopline.json', fileName: 'a.droopline.json', projectName: 'Alpha', usedAt: '2026-12-01T10:00:00.000Z', missing: false },
        { path: '/plants/b.droopline.json', fileName: 'b.droopline.json', projectName: 'Beta', usedAt: '2026-11-30T10:00:00.000Z', missing: true },
      ],
    });
    setHostClient(host);
    const project = useProjectStore();
    await project.start();
    const w = mount(FileBar);
    await w.get('[data-test="file-recent"]').trigger('click');
    const items = w.findAll('[data-test="file-recent-list"] button');
    expect(items.map((b) => b.text().split('·')[0]!.trim())).toEqual(['Alphaa.droopline.json', 'Betab.droopline.json']);
    expect(items[1]!.text()).toContain('missing');
    expect(items[1]!.attributes('disabled')).toBeDefined();
    await items[0]!.trigger('click');
    await flushPromises();
    await vi.waitFor(() => expect(project.name).toBe('From recent'));
    expect(host.calls).toContain('fileOpenPath');
  });

  it('offers to restore unsaved work found at start, and restores it', async () => {
    setHostClient(memoryHost({ recovery: { ...recovery }, recent: [] }));
    const project = useProjectStore();
    await project.start();
    const w = mount(ProjectDialogs);
    expect(w.get('[data-test="restore-prompt"]').text()).toContain('night.droopline.json');
    expect(w.get('[data-test="restore-prompt"]').attributes('role')).toBe('alertdialog');
    await w.get('[data-test="restore-accept"]').trigger('click');
    await vi.waitFor(() => expect(project.name).toBe('Night shift study'));
    expect(project.dirty).toBe(true);
    expect(project.fileName).toBe('night.droopline.json');
    await flushPromises();
    expect(w.find('[data-test="restore-prompt"]').exists()).toBe(false);
  });

  it('discards the recovery copy on request', async () => {
    const state = { recovery: { ...recovery } as RecoveryCopy | null, recent: [] };
    setHostClient(memoryHost(state));
    const project = useProjectStore();
    await project.start();
    const w = mount(ProjectDialogs);
    await w.get('[data-test="restore-discard"]').trigger('click');
    await flushPromises();
    expect(state.recovery).toBeNull();
    expect(project.name).toBe('Kestrel Ford Water Treatment Works (demo)');
    expect(w.find('[data-test="restore-prompt"]').exists()).toBe(false);
  });

  it('shows a refused file as an alert with an icon and the reason, never a stack', async () => {
    setHostClient(memoryHost({ recovery: null, recent: [] }));
    const project = useProjectStore();
    await project.start();
    await project.openText('{"format": "droopline.project", "version": 1, "plant": {', {
      path: null,
      fileName: 'broken.json',
      backupPath: '/plants/broken.json.bak',
    });
    const w = mount(ProjectNotice);
    const notice = w.get('[data-test="project-notice"]');
    expect(notice.attributes('role')).toBe('alert');
    expect(notice.text()).toContain('⚠');
    expect(notice.text()).toContain('Could not open "broken.json". The file stops in the middle of the project');
    expect(notice.text()).not.toMatch(/at \w+ \(|Error:/);
    expect(w.find('[data-test="open-backup"]').exists()).toBe(true);
    expect(usePlantStore().plant?.name).toBe('Kestrel Ford Water Treatment Works (demo)');
  });
});
