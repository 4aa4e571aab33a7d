/**
 * What the main process accepts over IPC, checked as if it came from a stranger:
 * the channel must be one we serve, the sender must be our own top-level page, and the
 * payload must match the channel's zod schema. Plain functions, unit-tested.
 */
import { z } from 'zod';
import { IPC } from '../shared/hostApi.ts';
import { PAPERS } from '../report/reportTypes.ts';
import { isAllowedNavigation } from './contentSecurity.ts';

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

/** Payload schema of every renderer -> main channel. */
export const ipcPayloadSchemas = {
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

export type IpcChannel = keyof typeof ipcPayloadSchemas;
export type IpcPayload<C extends IpcChannel> = z.output<(typeof ipcPayloadSchemas)[C]>;

export function isIpcChannel(channel: string): channel is IpcChannel {
  return Object.hasOwn(ipcPayloadSchemas, channel);
}

/** Who sent a message: the URL of the sending frame and whether it is the top frame. */
export interface IpcSender {
  frameUrl: string | undefined;
  isMainFrame: boolean;
}

export type IpcCheck<C extends IpcChannel> = { ok: true; payload: IpcPayload<C> } | { ok: false; reason: string };

/** Checks channel, sender and payload; returns the parsed payload or why it was refused. */
export function checkIpcMessage<C extends IpcChannel>(
  channel: C,
  sender: IpcSender,
  payload: unknown,
  devServerUrl: string | undefined,
): IpcCheck<C> {
  if (!isIpcChannel(channel)) return { ok: false, reason: `unknown channel ${JSON.stringify(channel)}` };
  if (!sender.isMainFrame) return { ok: false, reason: `${channel}: sender is not the top-level frame` };
  if (sender.frameUrl === undefined || !isAllowedNavigation(sender.frameUrl, devServerUrl)) {
    return { ok: false, reason: `${channel}: sender ${JSON.stringify(sender.frameUrl)} is not the app page` };
  }
  const parsed = ipcPayloadSchemas[channel].safeParse(payload);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    const where = first.path.length > 0 ? first.path.join('.') : 'payload';
    return { ok: false, reason: `${channel}: ${where} ${first.message}` };
  }
  return { ok: true, payload: parsed.data as IpcPayload<C> };
}
