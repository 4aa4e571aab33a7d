import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { MenuItemConstructorOptions } from 'electron';
import { acceleratorOf, COMMANDS, commandEntry, keyTextOf, MENU_COMMANDS, titleWithKey, type KeyBinding, type MenuCommand } from '../../src/shared/commands.ts';
import { menuTemplate } from '../../src/main/menu.ts';
import { commandForKey, type KeyPress } from '../../src/renderer/lib/shortcuts.ts';

const canonical = (b: KeyBinding) => `${b.mod ? 'mod+' : ''}${b.shift ? 'shift+' : ''}${b.alt ? 'alt+' : ''}${b.key}`;

/** Every key press the tests try: letters, digits, F1-F12 and the usual named keys, under all modifier sets. */
function everyPress(): KeyPress[] {
  const keys = [...'abcdefghijklmnopqrstuvwxyz0123456789', ...Array.from({ length: 12 }, (_, k) => `F${k + 1}`), 'Enter', 'Escape', 'Delete', 'ArrowUp'];
  const presses: KeyPress[] = [];
  for (const key of keys) {
    for (let m = 0; m < 16; m++) {
      const shiftKey = (m & 4) !== 0;
      presses.push({ key: shiftKey && key.length === 1 ? key.toUpperCase() : key, ctrlKey: (m & 1) !== 0, metaKey: (m & 2) !== 0, shiftKey, altKey: (m & 8) !== 0 });
    }
  }
  return presses;
}

const pressOf = (b: KeyBinding, modKey: 'ctrlKey' | 'metaKey'): KeyPress => ({
  key: b.shift && b.key.length === 1 ? b.key.toUpperCase() : b.key.length === 1 ? b.key : b.key.toUpperCase(),
  ctrlKey: b.mod === true && modKey === 'ctrlKey',
  metaKey: b.mod === true && modKey === 'metaKey',
  shiftKey: b.shift === true,
  altKey: b.alt === true,
});

describe('the command table', () => {
  it('names each command once, and no two commands share a key binding', () => {
    expect(new Set(MENU_COMMANDS).size).toBe(COMMANDS.length);
    const bindings = COMMANDS.flatMap((c) => c.keys.map(canonical));
    expect(new Set(bindings).size).toBe(bindings.length);
  });

  it('writes bindings for menus and titles', () => {
    expect(acceleratorOf('save-as')).toBe('CmdOrCtrl+Shift+S');
    expect(acceleratorOf('view-curves')).toBe('Alt+2');
    expect(acceleratorOf('show-model-notes')).toBe('F1');
    expect(acceleratorOf('print')).toBeUndefined();
    expect(keyTextOf('export-report-pdf')).toBe('Ctrl+Shift+E');
    expect(titleWithKey('undo')).toBe('Undo edit (Ctrl+Z)');
    expect(titleWithKey('export-daily-csv', 'Every daily series')).toBe('Every daily series');
  });
});

describe('shortcuts come from the table', () => {
  it('every binding of the table gives its command, with Ctrl or with Cmd', () => {
    for (const command of COMMANDS) {
      for (const binding of command.keys) {
        expect(commandForKey(pressOf(binding, 'ctrlKey')), canonical(binding)).toBe(command.id);
        expect(commandForKey(pressOf(binding, 'metaKey')), canonical(binding)).toBe(command.id);
      }
    }
  });

  it('no key press outside the table does anything', () => {
    const bound = new Set(COMMANDS.flatMap((c) => c.keys.map(canonical)));
    for (const press of everyPress()) {
      const asBinding = canonical({ key: press.key.toLowerCase(), mod: press.ctrlKey || press.metaKey, shift: press.shiftKey, alt: press.altKey });
      expect(commandForKey(press) !== null, asBinding).toBe(bound.has(asBinding));
    }
  });
});

describe('the native menu comes from the table', () => {
  const sent: MenuCommand[] = [];
  const template = menuTemplate([], { send: (c) => sent.push(c), openRecent: () => undefined, clearRecent: () => undefined }, false);
  const items = template.flatMap((menu) => (menu.submenu ?? []) as MenuItemConstructorOptions[]);

  it('every command item has the table label and accelerator', () => {
    const commandItems = items.filter((item) => typeof item.click === 'function');
    for (const item of commandItems) {
      sent.length = 0;
      (item.click as () => void)();
      expect(sent).toHaveLength(1);
      const entry = commandEntry(sent[0]);
      expect(item.label).toBe(entry.label);
      expect(item.accelerator).toBe(acceleratorOf(sent[0]));
      expect(item.registerAccelerator).toBe(false);
    }
  });

  it('offers every command of the table (open recent as its submenu)', () => {
    const offered: MenuCommand[] = [];
    for (const item of items) {
      if (typeof item.click !== 'function') continue;
      sent.length = 0;
      (item.click as () => void)();
      offered.push(...sent);
    }
    expect(items.find((item) => Array.isArray(item.submenu))?.label).toBe(commandEntry('open-recent').label);
    expect([...offered, 'open-recent'].sort()).toEqual([...MENU_COMMANDS].sort());
  });
});

describe('the renderer writes no binding of its own', () => {
  it('no source file of the renderer spells a command key outside comments', () => {
    const files = readdirSync('src/renderer', { recursive: true, encoding: 'utf8' }).filter((f) => /\.(ts|svelte)$/.test(f));
    const spelt = /\b(?:Ctrl|Cmd)\+(?:Shift\+)?[A-Z0-9]\b|\bAlt\+[0-9]\b|\bF1\b/;
    const offenders = files.filter((f) => {
      const code = readFileSync(join('src/renderer', f), 'utf8')
        .replace(/\/\*[\s\S]*?\*\//g, '')
        .replace(/<!--[\s\S]*?-->/g, '')
        .replace(/^\s*\/\/.*$/gm, '');
      return spelt.test(code);
    });
    expect(offenders).toEqual([]);
  });
});
