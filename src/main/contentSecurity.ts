/**
 * Content Security Policy and navigation rules for the app window.
 *
 * The renderer loads only its own bundle (scripts, worker, styles); no remote content, no
 * eval, no plugins, no frames. Inline style attributes are allowed because Svelte and
 * chart.js set element styles; inline scripts are not. 'wasm-unsafe-eval' lets the engine
 * workers compile the option kernel (src/engine/optionKernel.ts, WebAssembly bytes from the
 * bundle itself); it allows no JavaScript eval.
 */
import { APP_ORIGIN } from './appProtocol.ts';

export const CONTENT_SECURITY_POLICY = [
  "default-src 'none'",
  "script-src 'self' 'wasm-unsafe-eval'",
  "worker-src 'self'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
  "object-src 'none'",
].join('; ');

/** The app may only ever show its own pages: any navigation elsewhere is refused. */
export function isAllowedNavigation(url: string, devServerUrl: string | undefined): boolean {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return false;
  }
  // URL.origin is "null" for a non-special scheme such as ours, so compare scheme and host.
  if (`${parsed.protocol}//${parsed.host}` === APP_ORIGIN) return true;
  if (devServerUrl !== undefined) {
    try {
      return parsed.origin === new URL(devServerUrl).origin;
    } catch {
      return false;
    }
  }
  return false;
}
