/**
 * The native menu as plain data. Items that act on the document send a `MenuCommand` to
 * the renderer, which owns the document; their labels and accelerators come from the command
 * table (src/shared/commands.ts). Accelerators are shown but not registered
 * (`registerAccelerator: false`): the renderer handles the keys itself, the same way in
 * web mode, so each shortcut has exactly one path.
 */
import type { MenuItemConstructorOptions } from 'electron';
import type { RecentFile } from '../shared/hostApi.ts';
import { acceleratorOf, commandEntry, type MenuCommand } from '../shared/commands.ts';

export interface MenuActions {
  send(command: MenuCommand): void;
  openRecent(path: string): void;
  clearRecent(): void;
}

function command(id: MenuCommand, actions: MenuActions): MenuItemConstructorOptions {
  return { label: commandEntry(id).label, accelerator: acceleratorOf(id), registerAccelerator: false, click: () => actions.send(id) };
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
        command('new-from-demo', actions),
        command('open', actions),
        { label: commandEntry('open-recent').label, submenu: recentItems },
        { type: 'separator' },
        command('save', actions),
        command('save-as', actions),
        { type: 'separator' },
        command('print-report', actions),
        command('export-report-pdf', actions),
        command('export-table-csv', actions),
        command('export-daily-csv', actions),
        { type: 'separator' },
        command('print', actions),
        command('export-pdf', actions),
        { type: 'separator' },
        isMac ? { role: 'close' } : { role: 'quit', label: 'Quit' },
      ],
    },
    {
      label: 'Edit',
      submenu: [
        command('undo', actions),
        command('redo', actions),
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
        command('view-board', actions),
        command('view-curves', actions),
        command('view-by-age', actions),
        command('view-assumptions', actions),
        command('view-report', actions),
        command('view-spread', actions),
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
      submenu: [command('show-model-notes', actions), command('show-about', actions)],
    },
  ];
  return isMac ? [{ role: 'appMenu' }, ...template] : template;
}
