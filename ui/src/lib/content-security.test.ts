import { describe, expect, it } from 'vitest';
import { readCspNonce } from './content-security';

function documentWith(head: string): Document {
  return new DOMParser().parseFromString(`<html><head>${head}</head><body></body></html>`, 'text/html');
}

describe('readCspNonce', () => {
  it('reads the nonce the server wrote into the page', () => {
    expect(readCspNonce(documentWith('<meta property="csp-nonce" nonce="abc123==">'))).toBe('abc123==');
  });

  it('treats the unreplaced build placeholder (dev server) and a missing tag as no nonce', () => {
    expect(readCspNonce(documentWith('<meta property="csp-nonce" nonce="BEAMWRIGHT_CSP_NONCE">'))).toBeUndefined();
    expect(readCspNonce(documentWith(''))).toBeUndefined();
  });
});
