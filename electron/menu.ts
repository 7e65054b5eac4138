/** The application menu. File actions are forwarded to the renderer's project store. */
import { Menu } from 'electron';
import type { MenuItemConstructorOptions } from 'electron';
import type { HostCommand, RecentFile } from '../shared-types';

/** The "Open Recent" submenu: newest first, missing files greyed out. */
function recentItems(recent: readonly RecentFile[], onCommand: (command: HostCommand) => void): MenuItemConstructorOptions[] {
  if (recent.length === 0) return [{ label: 'No recent projects', enabled: false }];
  return recent.map((f) => ({
    label: `${f.projectName} — ${f.fileName}${f.missing ? ' (missing)' : ''}`,
    enabled: !f.missing,
    click: () => onCommand({ command: 'open-path', path: f.path }),
  }));
}

/**
 * Builds and installs the menu. File items send a `HostCommand` to the renderer's project
 * store; call again with the new list when the recent files change.
 */
export function setupMenu(onCommand: (command: HostCommand) => void, recent: readonly RecentFile[] = []): void {
  const template: MenuItemConstructorOptions[] = [
    {
      label: 'File',
      submenu: [
        { label: 'New Project', accelerator: 'CmdOrCtrl+N', click: () => onCommand({ command: 'new' }) },
        { label: 'Open…', accelerator: 'CmdOrCtrl+O', click: () => onCommand({ command: 'open' }) },
        { label: 'Open Recent', submenu: recentItems(recent, onCommand) },
        { type: 'separator' },
        { label: 'Save', accelerator: 'CmdOrCtrl+S', click: () => onCommand({ command: 'save' }) },
        { label: 'Save As…', accelerator: 'CmdOrCtrl+Shift+S', click: () => onCommand({ command: 'save-as' }) },
        { type: 'separator' },
        { role: 'quit' },
      ],
    },
    { role: 'editMenu' },
    { role: 'viewMenu' },
    { role: 'windowMenu' },
  ];
  Menu.setApplicationMenu(Menu.buildFromTemplate(template));
}
