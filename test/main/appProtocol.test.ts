import { describe, expect, it } from 'vitest';
import { join, resolve } from 'node:path';
import { assetPathFor, mimeTypeFor } from '../../src/main/appProtocol.ts';

const root = resolve('/opt/mixwise/renderer');

describe('assetPathFor', () => {
  it('maps app URLs to files under the renderer root', () => {
    expect(assetPathFor('mixwise://app/index.html', root)).toBe(join(root, 'index.html'));
    expect(assetPathFor('mixwise://app/', root)).toBe(join(root, 'index.html'));
    expect(assetPathFor('mixwise://app/assets/a%20b.js', root)).toBe(join(root, 'assets', 'a b.js'));
  });

  it('refuses other schemes, hosts and any escape from the root', () => {
    expect(assetPathFor('file:///etc/passwd', root)).toBeNull();
    expect(assetPathFor('mixwise://evil/index.html', root)).toBeNull();
    expect(assetPathFor('mixwise://app/..%2F..%2Fetc%2Fpasswd', root)).toBeNull();
    expect(assetPathFor('mixwise://app/%00', root)).toBeNull();
    expect(assetPathFor('mixwise://app/%E0%A4%A', root)).toBeNull();
  });
});

describe('mimeTypeFor', () => {
  it('names script, page and style types (module scripts need a JavaScript type)', () => {
    expect(mimeTypeFor('/x/index.html')).toMatch(/^text\/html/);
    expect(mimeTypeFor('/x/a.JS')).toMatch(/^text\/javascript/);
    expect(mimeTypeFor('/x/a.css')).toMatch(/^text\/css/);
    expect(mimeTypeFor('/x/a.bin')).toBe('application/octet-stream');
  });
});
