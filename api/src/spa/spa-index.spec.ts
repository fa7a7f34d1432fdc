import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { securityHeaders } from '../common/http/security-headers.js';
import { assignCspNonce, CSP_NONCE_PLACEHOLDER, serveSpaIndex } from './spa-index.js';

function appServing(html: string) {
  const dir = mkdtempSync(join(tmpdir(), 'bw-spa-'));
  writeFileSync(join(dir, 'index.html'), html);
  const app = express();
  app.use(assignCspNonce());
  app.use(securityHeaders({ hstsMaxAgeSeconds: 0, docsPath: '/api/docs' }));
  app.use(serveSpaIndex(dir));
  app.use((_request, response) => response.status(404).send('not the page'));
  return app;
}

const page = `<html><head><meta property="csp-nonce" nonce="${CSP_NONCE_PLACEHOLDER}"></head><body></body></html>`;

describe('serveSpaIndex', () => {
  it('writes the same fresh nonce into the page and its CSP header, new on every response', async () => {
    const app = appServing(page);
    const first = await request(app).get('/links/123').set('Accept', 'text/html').expect(200);
    const second = await request(app).get('/').expect(200);
    const nonceOf = (text: string) => /nonce="([^"]+)"/.exec(text)?.[1];
    const firstNonce = nonceOf(first.text);
    expect(firstNonce).toMatch(/^[A-Za-z0-9+/]{22}==$/);
    expect(first.headers['content-security-policy']).toContain(`'nonce-${firstNonce}'`);
    expect(nonceOf(second.text)).not.toBe(firstNonce);
    expect(first.text).not.toContain(CSP_NONCE_PLACEHOLDER);
    expect(first.headers['cache-control']).toBe('no-store');
  });

  it('leaves files and the API to the handlers after it', async () => {
    const app = appServing(page);
    await request(app).get('/assets/index-abc.js').expect(404, 'not the page');
    await request(app).get('/api/links').expect(404, 'not the page');
    await request(app).post('/links').expect(404, 'not the page');
  });
});
