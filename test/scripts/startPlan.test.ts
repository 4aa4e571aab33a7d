import { describe, expect, it } from 'vitest';
import { chromiumWindowArgs, hasDisplay, planStart, type MachineFacts } from '../../scripts/startPlan.ts';

const base: MachineFacts = {
  electronBinary: null,
  electronStarts: false,
  chromium: '/usr/bin/chromium',
  hasDisplay: true,
  isRoot: false,
  url: 'http://127.0.0.1:4173/',
  profileDir: '/home/a/.config/mixwise/chromium-window',
};

describe('what npm start opens', () => {
  it('the Electron app when its runtime starts', () => {
    expect(planStart({ ...base, electronBinary: '/x/electron', electronStarts: true })).toEqual({ kind: 'electron', binary: '/x/electron' });
  });

  it('a Chromium application window with its own profile when Electron cannot start', () => {
    for (const facts of [base, { ...base, electronBinary: '/x/electron', electronStarts: false }]) {
      const plan = planStart(facts);
      expect(plan.kind).toBe('chromium-window');
      if (plan.kind !== 'chromium-window') return;
      expect(plan.args).toContain('--app=http://127.0.0.1:4173/');
      expect(plan.args).toContain('--user-data-dir=/home/a/.config/mixwise/chromium-window');
      expect(plan.args).not.toContain('--no-sandbox');
      expect(plan.url).toBe('http://127.0.0.1:4173/');
      expect(plan.why).toMatch(/^Electron runtime is missing here \((binary not installed|binary does not start)\): opening the app in a Chromium window instead\.$/);
    }
  });

  it('only the address without Chromium or without a display', () => {
    expect(planStart({ ...base, chromium: null })).toEqual({ kind: 'web', url: base.url, why: 'Electron runtime is missing here (binary not installed), no Chromium installed: starting web mode instead.' });
    expect(planStart({ ...base, hasDisplay: false })).toMatchObject({ kind: 'web', why: expect.stringContaining('no display for a window') });
  });

  it('adds --no-sandbox for root, which Chromium requires', () => {
    expect(chromiumWindowArgs('http://h/', '/p', true)).toContain('--no-sandbox');
  });

  it('sees a display on Linux only through DISPLAY or WAYLAND_DISPLAY', () => {
    expect(hasDisplay('linux', {})).toBe(false);
    expect(hasDisplay('linux', { DISPLAY: ':0' })).toBe(true);
    expect(hasDisplay('linux', { WAYLAND_DISPLAY: 'wayland-0' })).toBe(true);
    expect(hasDisplay('darwin', {})).toBe(true);
  });
});
