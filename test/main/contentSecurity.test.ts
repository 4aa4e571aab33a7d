import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { CONTENT_SECURITY_POLICY, isAllowedNavigation } from '../../src/main/contentSecurity.ts';

describe('content security policy', () => {
  it('allows only the app itself: no remote, inline or eval script', () => {
    expect(CONTENT_SECURITY_POLICY).toContain("default-src 'none'");
    expect(CONTENT_SECURITY_POLICY).toContain("script-src 'self'");
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/script-src[^;]*('unsafe-inline'|'unsafe-eval'|https?:)/);
    expect(CONTENT_SECURITY_POLICY).toContain("object-src 'none'");
  });

  it('lets the engine workers compile the option kernel (WebAssembly), and nothing more', () => {
    const scripts = CONTENT_SECURITY_POLICY.split('; ').find((d) => d.startsWith('script-src '));
    expect(scripts).toBe("script-src 'self' 'wasm-unsafe-eval'");
  });

  it('is the same policy the renderer page declares (web mode has no main process)', () => {
    const html = readFileSync('src/renderer/index.html', 'utf8');
    const meta = /http-equiv="Content-Security-Policy"\s+content="([^"]+)"/.exec(html)?.[1];
    // frame-ancestors is ignored in a meta tag, so the page omits it.
    const expected = CONTENT_SECURITY_POLICY.split('; ').filter((d) => !d.startsWith('frame-ancestors')).join('; ');
    expect(meta).toBe(expected);
  });
});

describe('isAllowedNavigation', () => {
  it('accepts the app origin only', () => {
    expect(isAllowedNavigation('mixwise://app/index.html', undefined)).toBe(true);
    expect(isAllowedNavigation('https://example.org/', undefined)).toBe(false);
    expect(isAllowedNavigation('file:///etc/passwd', undefined)).toBe(false);
    expect(isAllowedNavigation('mixwise://other/index.html', undefined)).toBe(false);
    expect(isAllowedNavigation('not a url', undefined)).toBe(false);
  });

  it('accepts the dev server origin during development', () => {
    expect(isAllowedNavigation('http://localhost:5173/x', 'http://localhost:5173/')).toBe(true);
    expect(isAllowedNavigation('http://localhost:5174/x', 'http://localhost:5173/')).toBe(false);
  });
});
