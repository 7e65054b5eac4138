import { describe, it, expect, beforeEach, vi } from 'vitest';
import { createBrowserHost, RECOVERY_KEY } from '../../renderer/host/browser-host';
import type { HostCommand } from '../../shared-types';
import { projectText } from '../helpers/projects';

describe('browser preview host', () => {
  beforeEach(() => {
    localStorage.clear();
    delete (window as unknown as Record<string, unknown>).showSaveFilePicker;
    delete (window as unknown as Record<string, unknown>).showOpenFilePicker;
  });

  it('keeps the recovery copy in localStorage across page loads', async () => {
    const first = createBrowserHost(window);
    expect(await first.call('recoveryRead', {})).toBeNull();
    await first.call('recoveryWrite', { projectName: 'Study', path: null, fileName: null, text: projectText() });
    const second = createBrowserHost(window);
    const copy = await second.call('recoveryRead', {});
    expect(copy?.text).toBe(projectText());
    expect(copy?.projectName).toBe('Study');
    await second.call('recoveryDiscard', {});
    expect(localStorage.getItem(RECOVERY_KEY)).toBeNull();
  });

  it('downloads on Save As when the browser has no save picker, and keeps a recent copy', async () => {
    const host = createBrowserHost(window);
    expect(host.savesInPlace).toBe(false);
    const clicked: { download: string; href: string }[] = [];
    const spy = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicked.push({ download: this.download, href: this.href });
    });
    const saved = await host.call('fileSaveAs', { suggestedName: 'Pump: station', text: projectText() });
    spy.mockRestore();
    expect(saved).toMatchObject({ path: null, fileName: 'Pump station.droopline.json', backupFileName: null });
    expect(clicked).toHaveLength(1);
    expect(clicked[0]!.download).toBe('Pump station.droopline.json');
    await host.call('documentState', { projectName: 'Pump station', fileName: 'Pump station.droopline.json', path: null, dirty: false });
    const recent = await host.call('recentList', {});
    expect(recent.map((r) => [r.projectName, r.fileName])).toEqual([['Pump station', 'Pump station.droopline.json']]);
    const reopened = await host.call('fileOpenPath', { path: recent[0]!.path });
    expect(reopened).toEqual({ path: null, fileName: 'Pump station.droopline.json', text: projectText(), backupPath: null });
  });

  it('writes back through the File System Access API where present', async () => {
    const written: string[] = [];
    const handle = {
      name: 'site.droopline.json',
      getFile: async () => new File([projectText({ name: 'On disk' })], 'site.droopline.json'),
      createWritable: async () => ({ write: async (t: string) => void written.push(t), close: async () => undefined }),
    };
    Object.assign(window, { showOpenFilePicker: async () => [handle], showSaveFilePicker: async () => handle });
    const host = createBrowserHost(window);
    expect(host.savesInPlace).toBe(true);
    const opened = await host.call('fileOpenDialog', {});
    expect(opened?.text).toBe(projectText({ name: 'On disk' }));
    await host.call('fileSave', { path: opened!.path!, text: 'new text' });
    expect(written).toEqual(['new text']);
  });

  it('treats a cancelled picker as no choice', async () => {
    Object.assign(window, { showOpenFilePicker: async () => Promise.reject(new DOMException('The user aborted a request.', 'AbortError')) });
    expect(await createBrowserHost(window).call('fileOpenDialog', {})).toBeNull();
  });

  it('turns Ctrl+S, Ctrl+Shift+S and Ctrl+O into commands', () => {
    const host = createBrowserHost(window);
    const got: HostCommand[] = [];
    const off = host.onCommand((c) => got.push(c));
    window.dispatchEvent(new KeyboardEvent('keydown', { key: 's', ctrlKey: true }));
    window.dispatchEvent(new KeyboardEvent('keydown', { key: 'S', ctrlKey: true, shiftKey: true }));
    window.dispatchEvent(new KeyboardEvent('keydown', { key: 'o', metaKey: true }));
    window.dispatchEvent(new KeyboardEvent('keydown', { key: 's' }));
    off();
    expect(got).toEqual([{ command: 'save' }, { command: 'save-as' }, { command: 'open' }]);
  });

  it('asks before the page goes away with unsaved changes', async () => {
    const host = createBrowserHost(window);
    const ask = () => {
      const e = new Event('beforeunload', { cancelable: true });
      window.dispatchEvent(e);
      return e.defaultPrevented;
    };
    await host.call('documentState', { projectName: 'x', fileName: null, path: null, dirty: true });
    expect(ask()).toBe(true);
    await host.call('documentState', { projectName: 'x', fileName: null, path: null, dirty: false });
    expect(ask()).toBe(false);
  });
});
