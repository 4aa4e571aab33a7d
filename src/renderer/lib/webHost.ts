/**
 * The web implementation of `MixwiseHost` (web mode, no Electron): a file input to open,
 * a download to save, `window.print()` to print. Recent files are copies kept in this
 * browser's local storage, since a web page cannot reopen a path on disk.
 *
 * It answers the same IPC contract as the main process (src/shared/ipcContract.ts): one handler
 * per channel, reached through the same `hostOverIpc`, and every request is parsed with the
 * channel's schema first, so a request the desktop would refuse is refused here too.
 */
import { decodeUtf8Text } from '../../shared/textFile.ts';
import { parseScenarioText, formatProblem } from '../../engine/index.ts';
import { IPC, type MixwiseHost, type OpenedScenarioFile, type RecentFile, type SaveOutcome } from '../../shared/hostApi.ts';
import { parseIpcRequest, type IpcChannel, type IpcHandlers, type IpcReply } from '../../shared/ipcContract.ts';
import { hostOverIpc } from '../../shared/ipcHost.ts';

const RECENT_KEY = 'mixwise.recent';
const RECENT_COPY = (key: string) => `mixwise.recent.${key}`;
const MAX_RECENT = 8;

function readRecent(): RecentFile[] {
  try {
    const list: unknown = JSON.parse(localStorage.getItem(RECENT_KEY) ?? '[]');
    return Array.isArray(list) ? list.filter((r): r is RecentFile => typeof r?.name === 'string' && typeof r?.path === 'string') : [];
  } catch {
    return [];
  }
}

/** Keeps a copy of the file text under its name; the oldest copies drop off. */
function rememberCopy(name: string, text: string): void {
  const key = name;
  const list = [{ name, path: key }, ...readRecent().filter((r) => r.path !== key)];
  try {
    localStorage.setItem(RECENT_COPY(key), text);
    for (const dropped of list.slice(MAX_RECENT)) localStorage.removeItem(RECENT_COPY(dropped.path));
    localStorage.setItem(RECENT_KEY, JSON.stringify(list.slice(0, MAX_RECENT)));
  } catch {
    // Storage full or disabled: the recent list is a convenience, the file itself is safe.
  }
}

function pickFile(accept: string): Promise<File | null> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.style.display = 'none';
    input.dataset.testid = 'web-file-input';
    input.addEventListener('change', () => {
      resolve(input.files?.[0] ?? null);
      input.remove();
    });
    input.addEventListener('cancel', () => {
      resolve(null);
      input.remove();
    });
    document.body.append(input);
    input.click();
  });
}

/** Reads a UTF-8 file the user picks (shared with CSV import); another encoding throws one plain line. */
export async function pickTextFile(accept: string): Promise<{ name: string; text: string } | null> {
  const file = await pickFile(accept);
  if (file === null) return null;
  const decoded = decodeUtf8Text(new Uint8Array(await file.arrayBuffer()));
  if (!decoded.ok) throw new Error(`${file.name} ${decoded.rule}`);
  return { name: file.name, text: decoded.text };
}

function download(name: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = name;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/**
 * Prints a whole HTML document (the report) with the browser's print dialog, from a frame of
 * this page: sandboxed (no scripts; `allow-modals` lets print() open the dialog,
 * `allow-same-origin` lets this page call it), laid out off screen, removed after printing.
 */
function printHtmlInFrame(html: string): Promise<void> {
  document.querySelectorAll('iframe[data-print-frame]').forEach((old) => old.remove());
  return new Promise((resolve, reject) => {
    const frame = document.createElement('iframe');
    frame.dataset.printFrame = 'report';
    frame.setAttribute('sandbox', 'allow-same-origin allow-modals');
    frame.setAttribute('aria-hidden', 'true');
    frame.tabIndex = -1;
    frame.title = 'Report for printing';
    frame.style.cssText = 'position: fixed; left: 0; top: 0; width: 0; height: 0; border: 0; opacity: 0; pointer-events: none;';
    frame.addEventListener(
      'load',
      () => {
        const target = frame.contentWindow;
        if (target === null) {
          frame.remove();
          reject(new Error('The report could not be prepared for printing.'));
          return;
        }
        // (Not focused first: focus would stay in the hidden frame and the app's shortcuts would stop.)
        target.addEventListener('afterprint', () => frame.remove(), { once: true });
        target.print();
        resolve();
      },
      { once: true },
    );
    frame.srcdoc = html;
    document.body.append(frame);
  });
}

/** The page's answer to every channel of the contract. */
export const webHandlers: IpcHandlers<void> = {
  async [IPC.open](): Promise<OpenedScenarioFile | null> {
    const picked = await pickTextFile('.json,application/json');
    if (picked === null) return null;
    rememberCopy(picked.name, picked.text);
    return { name: picked.name, path: null, text: picked.text };
  },
  [IPC.openRecent]({ path }) {
    const text = localStorage.getItem(RECENT_COPY(path));
    return text === null ? null : { name: path, path: null, text };
  },
  [IPC.listRecent]: () => readRecent(),
  [IPC.save]({ suggestedName, text }): SaveOutcome {
    const check = parseScenarioText(text);
    if (!check.ok) return { ok: false, cancelled: false, message: `Not saved: the scenario is not valid.\n${check.problems.slice(0, 5).map(formatProblem).join('\n')}` };
    download(suggestedName, new Blob([text], { type: 'application/json' }));
    rememberCopy(suggestedName, text);
    return { ok: true, file: { name: suggestedName, path: null } };
  },
  [IPC.print]() {
    window.print();
  },
  [IPC.exportPdf](): SaveOutcome {
    // Browsers have no silent PDF export: their print dialog offers "Save as PDF".
    window.print();
    return { ok: false, cancelled: true };
  },
  async [IPC.printReport](report) {
    await printHtmlInFrame(report.html);
  },
  async [IPC.exportReportPdf](report): Promise<SaveOutcome> {
    // As for exportPdf: the print dialog's "Save as PDF" writes the file.
    await printHtmlInFrame(report.html);
    return { ok: false, cancelled: true };
  },
  [IPC.exportCsv]({ suggestedName, text }): SaveOutcome {
    download(suggestedName, new Blob([text], { type: 'text/csv;charset=utf-8' }));
    return { ok: true, file: { name: suggestedName, path: null } };
  },
  [IPC.documentState]({ title, dirty }) {
    document.title = `${dirty ? '• ' : ''}${title} — Mixwise`;
  },
};

/** Parses the request with its channel's schema, then runs the channel's handler; a refusal throws one line naming the field. */
function serve<C extends IpcChannel>(channel: C, payload: unknown): IpcReply<C> | Promise<IpcReply<C>> {
  const check = parseIpcRequest(channel, payload);
  if (!check.ok) throw new Error(`Refused: ${check.reason}`);
  return webHandlers[channel](check.request);
}

export function createWebHost(): MixwiseHost {
  return hostOverIpc(
    'web',
    {
      invoke: async (channel, request) => serve(channel, request),
      send(channel, request) {
        try {
          void serve(channel, request);
        } catch (err) {
          // As in the desktop's main process: a refused one-way message is logged and dropped.
          console.warn((err as Error).message);
        }
      },
    },
    // No native menu in a browser: the app's own toolbar and shortcuts do the same work.
    () => () => undefined,
  );
}
