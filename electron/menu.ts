/** The application menu. File actions are forwarded to the renderer's project store. */
import { Menu } from 'electron';
import type { MenuItemConstructorOptions } from 'electron';

/** Builds and installs the menu. `onCommand` receives "open", "save", "save-as". */
export function setupMenu(onCommand: (command: 'open' | 'save' | 'save-as') => void): void {
  const template: MenuItemConstructorOptions[] = [
    {
      label: 'File',
      submenu: [
        { label: 'Open…', accelerator: 'CmdOrCtrl+O', click: () => onCommand('open') },
        { label: 'Save', accelerator: 'CmdOrCtrl+S', click: () => onCommand('save') },
        { label: 'Save As…', accelerator: 'CmdOrCtrl+Shift+S', click: () => onCommand('save-as') },
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
