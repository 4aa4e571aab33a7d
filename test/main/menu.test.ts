import { describe, expect, it } from 'vitest';
import type { MenuItemConstructorOptions } from 'electron';
import { menuTemplate } from '../../src/main/menu.ts';
import type { MenuCommand } from '../../src/shared/hostApi.ts';

function items(template: MenuItemConstructorOptions[], label: string): MenuItemConstructorOptions[] {
  const menu = template.find((m) => m.label === label);
  return (menu?.submenu ?? []) as MenuItemConstructorOptions[];
}

describe('menuTemplate', () => {
  const sent: MenuCommand[] = [];
  const opened: string[] = [];
  const actions = { send: (c: MenuCommand) => sent.push(c), openRecent: (p: string) => opened.push(p), clearRecent: () => undefined };
  const template = menuTemplate([{ name: 'a.json', path: '/data/a.json' }], actions, false);

  it('has File, Edit, View and Help menus', () => {
    expect(template.map((m) => m.label)).toEqual(['File', 'Edit', 'View', 'Help']);
  });

  it('sends document commands to the renderer and shows (not registers) their shortcuts', () => {
    const save = items(template, 'File').find((i) => i.label === 'Save');
    expect(save?.accelerator).toBe('CmdOrCtrl+S');
    expect(save?.registerAccelerator).toBe(false);
    (save?.click as () => void)();
    expect(sent).toContain('save');
  });

  it('lists recent files and opens them by path', () => {
    const recent = items(template, 'File').find((i) => i.label === 'Open recent');
    const first = (recent?.submenu as MenuItemConstructorOptions[])[0];
    expect(first.label).toBe('a.json');
    (first.click as () => void)();
    expect(opened).toEqual(['/data/a.json']);
  });

  it('offers model notes and About under Help', () => {
    expect(items(template, 'Help').map((i) => i.label)).toEqual(['Model notes', 'About Mixwise']);
  });

  it('puts the app menu first on macOS', () => {
    expect(menuTemplate([], actions, true)[0].role).toBe('appMenu');
  });
});
