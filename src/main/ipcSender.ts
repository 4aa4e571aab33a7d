/**
 * What the main process accepts over IPC, checked as if it came from a stranger: the channel
 * must be one we serve, the sender must be our own top-level page, and the payload must match
 * the channel's schema in the shared contract (src/shared/ipcContract.ts). Plain functions,
 * unit-tested.
 */
import { parseIpcRequest, isIpcChannel, type IpcChannel, type IpcParse } from '../shared/ipcContract.ts';
import { isAllowedNavigation } from './contentSecurity.ts';

/** Who sent a message: the URL of the sending frame and whether it is the top frame. */
export interface IpcSender {
  frameUrl: string | undefined;
  isMainFrame: boolean;
}

/** Checks channel, sender and payload; returns the parsed request or why it was refused. */
export function checkIpcMessage<C extends IpcChannel>(channel: C, sender: IpcSender, payload: unknown, devServerUrl: string | undefined): IpcParse<C> {
  if (!isIpcChannel(channel)) return { ok: false, reason: `unknown channel ${JSON.stringify(channel)}` };
  if (!sender.isMainFrame) return { ok: false, reason: `${channel}: sender is not the top-level frame` };
  if (sender.frameUrl === undefined || !isAllowedNavigation(sender.frameUrl, devServerUrl)) {
    return { ok: false, reason: `${channel}: sender ${JSON.stringify(sender.frameUrl)} is not the app page` };
  }
  return parseIpcRequest(channel, payload);
}
