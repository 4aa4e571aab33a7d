/**
 * The native menu as plain data. Items that act on the document send a `MenuCommand` to
 * the renderer, which owns the document. Accelerators are shown but not registered
 * (`registerAccelerator: false`): the renderer handles the keys itself, the same way in
 * web mode, so each shortcut has exactly one path.
 */
import type { MenuItemConstructorOptions } from 'electron';
import type { MenuCommand, RecentFile } from '../shared/hostApi.ts';

export interface MenuActions {
  send(command: MenuCommand): void;
  openRecent(path: string): void;
  clearRecent(): void;
}

function command(label: string, cmd: MenuCommand, actions: MenuActions, accelerator?: string): MenuItemConstructorOptions {
  return { label, accelerator, registerAccelerator: false, click: () => actions.send(cmd) };
}

export function menuTemplate(recent: readonly RecentFile[], actions: MenuActions, isMac: boolean): MenuItemConstructorOptions[] {
  const recentItems: MenuItemConstructorOptions[] =
    recent.length === 0
      ? [{ label: 'No recent files', enabled: false }]
      : [
          ...recent.map((r): MenuItemConstructorOptions => ({ label: r.name, toolTip: r.path, click: () => actions.openRecent(r.path) })),
          { type: 'separator' },
          { label: 'Clear list', click: () => actions.clearRecent() },
        ];
  const template: MenuItemConstructorOptions[] = [
    {
      label: 'File',
      submenu: [
        command('New from demo', 'new-from-demo', actions, 'CmdOrCtrl+N'),
        command('Open…', 'open', actions, 'CmdOrCtrl+O'),
        { label: 'Open recent', submenu: recentItems },
        { type: 'separator' },
        command('Save', 'save', actions, 'CmdOrCtrl+S'),
        command('Save as…', 'save-as', actions, 'CmdOrCtrl+Shift+S'),
        { type: 'separator' },
        command('Print report…', 'print-report', actions, 'CmdOrCtrl+P'),
        command('Export report as PDF…', 'export-report-pdf', actions, 'CmdOrCtrl+Shift+E'),
        command('Export table CSV…', 'export-table-csv', actions, 'CmdOrCtrl+E'),
        command('Export daily series CSV…', 'export-daily-csv', actions),
        { type: 'separator' },
        command('Print this view…', 'print', actions),
        command('Export this view as PDF…', 'export-pdf', actions),
        { type: 'separator' },
        isMac ? { role: 'close' } : { role: 'quit', label: 'Quit' },
      ],
    },
    {
      label: 'Edit',
      submenu: [
        command('Undo edit', 'undo', actions, 'CmdOrCtrl+Z'),
        command('Redo edit', 'redo', actions, 'CmdOrCtrl+Shift+Z'),
        { type: 'separator' },
        { role: 'cut' },
        { role: 'copy' },
        { role: 'paste' },
        { role: 'selectAll' },
      ],
    },
    {
      label: 'View',
      submenu: [
        command('Options board', 'view-board', actions, 'Alt+1'),
        command('Curves', 'view-curves', actions, 'Alt+2'),
        command('By age', 'view-by-age', actions, 'Alt+3'),
        command('Assumptions', 'view-assumptions', actions, 'Alt+4'),
        command('Report', 'view-report', actions, 'Alt+5'),
        { type: 'separator' },
        { role: 'resetZoom' },
        { role: 'zoomIn' },
        { role: 'zoomOut' },
        { type: 'separator' },
        { role: 'togglefullscreen' },
      ],
    },
    {
      label: 'Help',
      submenu: [command('Model notes', 'show-model-notes', actions, 'F1'), command('About Mixwise', 'show-about', actions)],
    },
  ];
  return isMac ? [{ role: 'appMenu' }, ...template] : template;
}
