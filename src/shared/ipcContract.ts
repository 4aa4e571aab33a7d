/**
 * The one IPC contract between the renderer and its host: for each channel the request's zod
 * schema and the reply's type. Main (ipcHandlers.ts) and the web host (webHost.ts) parse every
 * request with these schemas before acting; the preload and the web host call the channels
 * through one typed `invoke` (ipcHost.ts). The channel list is the keys of `ipcRequestSchemas`.
 *
 * Channel names live in hostApi.ts, which has no zod: the sandboxed preload imports it and only
 * the types of this module.
 */
import { z } from 'zod';
import { PAPERS } from '../report/index.ts';
import { IPC, type OpenedScenarioFile, type RecentFile, type SaveOutcome } from './hostApi.ts';

const fileName = z
  .string()
  .min(1)
  .max(255)
  .refine((s) => !/[\\/\0]/.test(s), { message: 'must be a file name, not a path' });
const filePath = z.string().min(1).max(4096).refine((s) => !s.includes('\0'), { message: 'must not contain NUL' });

/** Largest report HTML accepted (the demo's report is about 150 kB; 12 options about 0.5 MB). */
export const MAX_REPORT_HTML_CHARS = 20 * 1024 * 1024;
/** Largest CSV accepted (the demo's daily series is about 6 MB in long format). */
export const MAX_CSV_CHARS = 100 * 1024 * 1024;

/** A file name that must end in `.ext` (case-insensitive). */
const fileNameWith = (ext: string) =>
  fileName.refine((s) => s.toLowerCase().endsWith(`.${ext}`), { message: `must end in .${ext}` });

/**
 * The report's HTML: a whole document, within the size cap, with no script element. It is shown
 * with JavaScript off under a no-script CSP anyway; refusing scripts here keeps a forged message
 * from ever reaching that window. (The report escapes every user text, so `<script` never occurs
 * in a genuine one.)
 */
const reportHtml = z
  .string()
  .max(MAX_REPORT_HTML_CHARS, { message: `must be at most ${MAX_REPORT_HTML_CHARS} characters` })
  .refine((s) => /^\s*<!DOCTYPE html>/i.test(s), { message: 'must be an HTML document' })
  .refine((s) => !/<script/i.test(s), { message: 'must not contain a script element' });

const reportDocument = {
  html: reportHtml,
  paper: z.enum(PAPERS),
  orientation: z.enum(['portrait', 'landscape']),
};

/** Request schema of every renderer -> host channel. */
export const ipcRequestSchemas = {
  [IPC.open]: z.undefined(),
  [IPC.openRecent]: z.object({ path: filePath }).strict(),
  [IPC.listRecent]: z.undefined(),
  [IPC.save]: z
    .object({ path: filePath.nullable(), suggestedName: fileName, text: z.string().max(5 * 1024 * 1024) })
    .strict(),
  [IPC.print]: z.undefined(),
  [IPC.exportPdf]: z.object({ suggestedName: fileName }).strict(),
  [IPC.printReport]: z.object(reportDocument).strict(),
  [IPC.exportReportPdf]: z.object({ ...reportDocument, suggestedName: fileNameWith('pdf') }).strict(),
  [IPC.exportCsv]: z
    .object({ suggestedName: fileNameWith('csv'), text: z.string().max(MAX_CSV_CHARS, { message: `must be at most ${MAX_CSV_CHARS} characters` }) })
    .strict(),
  [IPC.documentState]: z.object({ title: z.string().max(500), dirty: z.boolean() }).strict(),
} as const;

export type IpcChannel = keyof typeof ipcRequestSchemas;
export type IpcRequest<C extends IpcChannel> = z.output<(typeof ipcRequestSchemas)[C]>;

/** What the host answers on each channel. `document:state` is one-way: sent, never answered. */
export interface IpcReplies {
  [IPC.open]: OpenedScenarioFile | null;
  [IPC.openRecent]: OpenedScenarioFile | null;
  [IPC.listRecent]: RecentFile[];
  [IPC.save]: SaveOutcome;
  [IPC.print]: void;
  [IPC.exportPdf]: SaveOutcome;
  [IPC.printReport]: void;
  [IPC.exportReportPdf]: SaveOutcome;
  [IPC.exportCsv]: SaveOutcome;
  [IPC.documentState]: void;
}
export type IpcReply<C extends IpcChannel> = IpcReplies[C];

/** The channel sent without a reply (`ipcRenderer.send`); every other one is invoked. */
export type IpcOneWayChannel = typeof IPC.documentState;
export type IpcInvokeChannel = Exclude<IpcChannel, IpcOneWayChannel>;

/** Every renderer -> host channel, in the contract's order. */
export const IPC_CHANNELS = Object.keys(ipcRequestSchemas) as IpcChannel[];

export function isIpcChannel(channel: string): channel is IpcChannel {
  return Object.hasOwn(ipcRequestSchemas, channel);
}

export type IpcParse<C extends IpcChannel> = { ok: true; request: IpcRequest<C> } | { ok: false; reason: string };

/** Parses a request with its channel's schema; a refusal names the channel, the field and the rule. */
export function parseIpcRequest<C extends IpcChannel>(channel: C, payload: unknown): IpcParse<C> {
  if (!isIpcChannel(channel)) return { ok: false, reason: `unknown channel ${JSON.stringify(channel)}` };
  const parsed = ipcRequestSchemas[channel].safeParse(payload);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    const where = first.path.length > 0 ? first.path.join('.') : 'payload';
    return { ok: false, reason: `${channel}: ${where} ${first.message}` };
  }
  return { ok: true, request: parsed.data as IpcRequest<C> };
}

/** A host's answer to every channel, given the parsed request and what the host needs (main: the window). */
export type IpcHandlers<Context> = { [C in IpcChannel]: (request: IpcRequest<C>, context: Context) => IpcReply<C> | Promise<IpcReply<C>> };
