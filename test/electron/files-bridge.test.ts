// @vitest-environment node
/** The preload's host bridge and the File menu, with `electron` mocked. */
import { describe, it, expect, vi } from 'vitest';
import type { DrooplineBridge, HostCommand, RecentFile } from '../../shared-types';

const h = vi.hoisted(() => ({
  exposed: new Map<string, unknown>(),
  invoke: vi.fn(async (..._a: unknown[]) => ({ ok: true, value: null })),
  listeners: new Map<string, (...a: unknown[]) => void>(),
  removed: [] as string[],
  menu: [] as unknown[],
}));

vi.mock('electron', () => ({
  contextBridge: { exposeInMainWorld: (key: string, api: unknown) => h.exposed.set(key, api) },
  ipcRenderer: {
    invoke: h.invoke,
    send: vi.fn(),
    on: (ch: string, fn: (...a: unknown[]) => void) => h.listeners.set(ch, fn),
    removeListener: (ch: string) => h.removed.push(ch),
  },
  webUtils: { getPathForFile: (f: { fakePath: string }) => f.fakePath },
  Menu: { setApplicationMenu: (m: unknown) => h.menu.push(m), buildFromTemplate: (t: unknown) => t },
}));

await import('../../electron/preload');
const { setupMenu } = await import('../../electron/menu');

describe('preload host bridge', () => {
  const bridge = h.exposed.get('droopline') as DrooplineBridge;

  it('is frozen and forwards host calls on the channel named by the method', async () => {
    expect(Object.isFrozen(bridge)).toBe(true);
    expect(Object.isFrozen(bridge.host)).toBe(true);
    await bridge.host.invoke('fileSave', { path: '/p/a.json', text: '{}' });
    expect(h.invoke).toHaveBeenLastCalledWith('fileSave', { path: '/p/a.json', text: '{}' });
  });

  it('delivers pushed commands and unsubscribes', () => {
    const got: HostCommand[] = [];
    const off = bridge.host.onCommand((c) => got.push(c));
    h.listeners.get('hostCommand')!({}, { command: 'save' });
    off();
    expect(got).toEqual([{ command: 'save' }]);
    expect(h.removed).toContain('hostCommand');
  });

  it('opens a dropped file on its own channel with the path Electron gives, never a path from the page', async () => {
    await bridge.host.openDropped({ fakePath: '/plants/site.json' });
    expect(h.invoke).toHaveBeenLastCalledWith('hostOpenDropped', { path: '/plants/site.json' });
    h.invoke.mockClear();
    expect(await bridge.host.openDropped({ fakePath: '' })).toBeNull();
    expect(h.invoke).not.toHaveBeenCalled();
  });

  it('refuses channel names outside the contract (the page cannot reach a private channel)', async () => {
    h.invoke.mockClear();
    const host = await bridge.host.invoke('hostOpenDropped' as never, { path: '/etc/passwd.json' } as never);
    expect(host).toEqual({ ok: false, error: { name: 'HostError', code: 'REFUSED', message: '"hostOpenDropped" is not a Droopline method.' } });
    const engine = await bridge.invoke('fileSave' as never, 1, {} as never);
    expect(engine).toEqual({ ok: false, error: { name: 'EngineError', code: 'UNKNOWN_METHOD', message: '"fileSave" is not a Droopline method.' } });
    expect(h.invoke).not.toHaveBeenCalled();
    await bridge.invoke('solveSharing', 2, {} as never);
    expect(h.invoke).toHaveBeenLastCalledWith('solveSharing', 2, {});
  });
});

describe('File menu', () => {
  type Item = { label?: string; enabled?: boolean; submenu?: Item[]; click?: () => void };
  const fileMenu = () => (h.menu.at(-1) as Item[])[0]!.submenu as Item[];

  it('sends each file command and lists recent projects, missing ones disabled', () => {
    const sent: HostCommand[] = [];
    const recent: RecentFile[] = [
      { path: '/p/a.json', fileName: 'a.json', projectName: 'Alpha', usedAt: '2026-12-01T00:00:00Z', missing: false },
      { path: '/p/b.json', fileName: 'b.json', projectName: 'Beta', usedAt: '2026-11-01T00:00:00Z', missing: true },
    ];
    setupMenu((c) => sent.push(c), recent);
    const items = fileMenu();
    for (const label of ['New Project', 'Open…', 'Save', 'Save As…']) items.find((i) => i.label === label)!.click!();
    const recentMenu = items.find((i) => i.label === 'Open Recent')!.submenu!;
    expect(recentMenu.map((i) => [i.label, i.enabled])).toEqual([
      ['Alpha — a.json', true],
      ['Beta — b.json (missing)', false],
    ]);
    recentMenu[0]!.click!();
    expect(sent).toEqual([{ command: 'new' }, { command: 'open' }, { command: 'save' }, { command: 'save-as' }, { command: 'open-path', path: '/p/a.json' }]);
    setupMenu(() => undefined, []);
    expect(
      fileMenu()
        .find((i) => i.label === 'Open Recent')!
        .submenu!.map((i) => i.label),
    ).toEqual(['No recent projects']);
  });
});
