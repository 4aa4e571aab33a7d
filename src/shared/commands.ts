/**
 * The one table of the app's commands: id, label and key bindings. The native menu
 * (src/main/menu.ts) takes its items and accelerators from it, the renderer's shortcuts
 * (src/renderer/lib/shortcuts.ts) match keys against it, and buttons show its binding in their
 * titles. Adding a command or a key is one entry here.
 *
 * `mod` is Ctrl on Windows and Linux, Cmd on macOS (Electron's CmdOrCtrl).
 */

/** A key with its modifiers; `key` as `KeyboardEvent.key` gives it (letters lower case). */
export interface KeyBinding {
  key: string;
  mod?: boolean;
  shift?: boolean;
  alt?: boolean;
}

export interface CommandEntry {
  readonly id: string;
  /** The command's name in the menu. */
  readonly label: string;
  /** Key bindings: the first is shown in the menu and in titles, any other is also accepted. */
  readonly keys: readonly KeyBinding[];
}

export const COMMANDS = [
  { id: 'new-from-demo', label: 'New from demo', keys: [{ key: 'n', mod: true }] },
  { id: 'open', label: 'Open…', keys: [{ key: 'o', mod: true }] },
  { id: 'open-recent', label: 'Open recent', keys: [] },
  { id: 'save', label: 'Save', keys: [{ key: 's', mod: true }] },
  { id: 'save-as', label: 'Save as…', keys: [{ key: 's', mod: true, shift: true }] },
  { id: 'print', label: 'Print this view…', keys: [] },
  { id: 'export-pdf', label: 'Export this view as PDF…', keys: [] },
  { id: 'print-report', label: 'Print report…', keys: [{ key: 'p', mod: true }] },
  { id: 'export-report-pdf', label: 'Export report as PDF…', keys: [{ key: 'e', mod: true, shift: true }] },
  { id: 'export-table-csv', label: 'Export table CSV…', keys: [{ key: 'e', mod: true }] },
  { id: 'export-daily-csv', label: 'Export daily series CSV…', keys: [] },
  { id: 'undo', label: 'Undo edit', keys: [{ key: 'z', mod: true }] },
  { id: 'redo', label: 'Redo edit', keys: [{ key: 'z', mod: true, shift: true }, { key: 'y', mod: true }] },
  { id: 'view-board', label: 'Options board', keys: [{ key: '1', alt: true }] },
  { id: 'view-curves', label: 'Curves', keys: [{ key: '2', alt: true }] },
  { id: 'view-by-age', label: 'By age', keys: [{ key: '3', alt: true }] },
  { id: 'view-assumptions', label: 'Assumptions', keys: [{ key: '4', alt: true }] },
  { id: 'view-report', label: 'Report', keys: [{ key: '5', alt: true }] },
  { id: 'view-spread', label: 'Spread', keys: [{ key: '6', alt: true }] },
  { id: 'show-model-notes', label: 'Model notes', keys: [{ key: 'f1' }] },
  { id: 'show-about', label: 'About Mixwise', keys: [] },
] as const satisfies readonly CommandEntry[];

/** Commands the native menu (or a shortcut, or a button) asks the renderer to carry out. */
export type MenuCommand = (typeof COMMANDS)[number]['id'];
export const MENU_COMMANDS: readonly MenuCommand[] = COMMANDS.map((c) => c.id);

export function commandEntry(id: MenuCommand): CommandEntry {
  return COMMANDS.find((c) => c.id === id) as CommandEntry;
}

/** "F1", "S", "1" as menus and titles write a key. */
const keyName = (key: string) => (key.length === 1 ? key.toUpperCase() : key.charAt(0).toUpperCase() + key.slice(1));

function joined(binding: KeyBinding, mod: string): string {
  return [binding.mod ? mod : null, binding.shift ? 'Shift' : null, binding.alt ? 'Alt' : null, keyName(binding.key)].filter((p) => p !== null).join('+');
}

/** The command's shown binding as an Electron accelerator ("CmdOrCtrl+Shift+S"); undefined without one. */
export function acceleratorOf(id: MenuCommand): string | undefined {
  const first = commandEntry(id).keys[0];
  return first === undefined ? undefined : joined(first, 'CmdOrCtrl');
}

/** The command's shown binding as the app writes it in titles and hints ("Ctrl+Shift+S"); null without one. */
export function keyTextOf(id: MenuCommand): string | null {
  const first = commandEntry(id).keys[0];
  return first === undefined ? null : joined(first, 'Ctrl');
}

/** A button's title: what it does (by default the command's label), then its binding in parentheses when it has one. */
export function titleWithKey(id: MenuCommand, what: string = commandEntry(id).label): string {
  const keys = keyTextOf(id);
  return keys === null ? what : `${what} (${keys})`;
}
