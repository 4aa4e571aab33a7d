/**
 * The app's own URL scheme, `mixwise://app/...`, serving the built renderer from disk.
 * A standard, secure scheme gives the page a real origin (module workers and 'self' in the
 * CSP work as on the web) without opening file:// to the renderer.
 */
import { resolve, sep } from 'node:path';

export const APP_SCHEME = 'mixwise';
export const APP_HOST = 'app';
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;
export const APP_ENTRY_URL = `${APP_ORIGIN}/index.html`;

/**
 * Maps a request URL to a file under `rootDir`, or null when the URL is not ours or would
 * escape the root (e.g. `..` segments, encoded or not).
 */
export function assetPathFor(requestUrl: string, rootDir: string): string | null {
  let url: URL;
  try {
    url = new URL(requestUrl);
  } catch {
    return null;
  }
  if (url.protocol !== `${APP_SCHEME}:` || url.host !== APP_HOST) return null;
  let pathname: string;
  try {
    pathname = decodeURIComponent(url.pathname);
  } catch {
    return null;
  }
  if (pathname.includes('\0')) return null;
  const root = resolve(rootDir);
  const target = resolve(root, `.${pathname === '/' ? '/index.html' : pathname}`);
  return target === root || target.startsWith(root + sep) ? target : null;
}

const MIME_TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.woff2': 'font/woff2',
};

export function mimeTypeFor(path: string): string {
  const dot = path.lastIndexOf('.');
  return (dot >= 0 && MIME_TYPES[path.slice(dot).toLowerCase()]) || 'application/octet-stream';
}
