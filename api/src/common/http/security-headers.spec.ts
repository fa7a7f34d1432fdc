import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { assignCspNonce } from '../../spa/spa-index.js';
import { noStoreForApi, securityHeaders } from './security-headers.js';

function appWith(hstsMaxAgeSeconds: number) {
  const app = express();
  app.use(assignCspNonce());
  app.use(securityHeaders({ hstsMaxAgeSeconds, docsPath: '/api/docs' }));
  app.use(noStoreForApi('api'));
  app.get(['/', '/api/docs', '/api/thing'], (_request, response) => response.send('ok'));
  return app;
}

describe('securityHeaders', () => {
  it('sends HSTS only when a max-age is configured (deployments behind TLS)', async () => {
    const off = await request(appWith(0)).get('/');
    expect(off.headers['strict-transport-security']).toBeUndefined();
    const on = await request(appWith(31_536_000)).get('/');
    expect(on.headers['strict-transport-security']).toBe('max-age=31536000; includeSubDomains');
  });

  it('gives the app a strict policy and only the API docs inline styles', async () => {
    const page = await request(appWith(0)).get('/');
    const policy = page.headers['content-security-policy'] as string;
    // styles: the origin and this response's nonce only, never 'unsafe-inline'
    expect(policy).toMatch(/style-src 'self' 'nonce-[A-Za-z0-9+/]{22}=='/);
    expect(policy).not.toContain('unsafe-inline');
    expect(policy).not.toContain('data:;font');
    expect(policy).toContain("font-src 'self';");
    const docs = await request(appWith(0)).get('/api/docs');
    expect(docs.headers['content-security-policy']).toContain("style-src 'self' 'unsafe-inline'");
    expect(docs.headers['content-security-policy']).toContain("script-src 'self';");
  });

  it('marks only API answers no-store (the SPA assets stay cacheable)', async () => {
    expect((await request(appWith(0)).get('/api/thing')).headers['cache-control']).toBe('no-store');
    expect((await request(appWith(0)).get('/')).headers['cache-control']).toBeUndefined();
  });
});
