import { describe, expect, it } from 'vitest';
import { checkIpcMessage } from '../../src/main/ipcSender.ts';
import { isIpcChannel } from '../../src/shared/ipcContract.ts';
import { IPC } from '../../src/shared/hostApi.ts';

const app = { frameUrl: 'mixwise://app/index.html', isMainFrame: true };

describe('checkIpcMessage', () => {
  it('accepts a well-formed save from the app page', () => {
    const check = checkIpcMessage(IPC.save, app, { path: null, suggestedName: 'a.json', text: '{}' }, undefined);
    expect(check).toEqual({ ok: true, request: { path: null, suggestedName: 'a.json', text: '{}' } });
  });

  it('refuses unknown channels', () => {
    expect(isIpcChannel('scenario:delete-everything')).toBe(false);
    expect(isIpcChannel('__proto__')).toBe(false);
    expect(isIpcChannel(IPC.open)).toBe(true);
  });

  it('refuses senders that are not the app top frame', () => {
    const sub = checkIpcMessage(IPC.listRecent, { ...app, isMainFrame: false }, undefined, undefined);
    expect(sub).toMatchObject({ ok: false, reason: expect.stringContaining('top-level frame') });
    const remote = checkIpcMessage(IPC.listRecent, { frameUrl: 'https://example.org/', isMainFrame: true }, undefined, undefined);
    expect(remote).toMatchObject({ ok: false, reason: expect.stringContaining('is not the app page') });
    const none = checkIpcMessage(IPC.listRecent, { frameUrl: undefined, isMainFrame: true }, undefined, undefined);
    expect(none.ok).toBe(false);
  });

  it('refuses payloads that do not match the channel schema, naming the field', () => {
    const pathAsName = checkIpcMessage(IPC.save, app, { path: null, suggestedName: '../x.json', text: '' }, undefined);
    expect(pathAsName).toMatchObject({ ok: false, reason: expect.stringContaining('suggestedName') });
    const extra = checkIpcMessage(IPC.save, app, { path: null, suggestedName: 'a.json', text: '', shell: 'rm' }, undefined);
    expect(extra.ok).toBe(false);
    const wrongType = checkIpcMessage(IPC.documentState, app, { title: 'x', dirty: 'yes' }, undefined);
    expect(wrongType).toMatchObject({ ok: false, reason: expect.stringContaining('dirty') });
    const unexpected = checkIpcMessage(IPC.open, app, { path: '/etc/passwd' }, undefined);
    expect(unexpected.ok).toBe(false);
    const nul = checkIpcMessage(IPC.openRecent, app, { path: '/tmp/a\0b' }, undefined);
    expect(nul.ok).toBe(false);
  });
});
