import type { INestApplication } from '@nestjs/common';
import type { AddressInfo, Server } from 'node:net';
import { connect } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp } from './utils/test-app.js';

/** Sends raw bytes and collects whatever the server answers until it closes the connection. */
function rawExchange(port: number, head: string, bodyPart: string, giveUpMs: number): Promise<{ answer: string; closedAfterMs: number }> {
  return new Promise((resolve, reject) => {
    const startedAt = performance.now();
    const socket = connect(port, '127.0.0.1');
    let answer = '';
    const giveUp = setTimeout(() => {
      socket.destroy();
      reject(new Error(`no close within ${giveUpMs} ms; answer so far: ${JSON.stringify(answer.slice(0, 200))}`));
    }, giveUpMs);
    socket.setEncoding('utf8');
    socket.on('data', (chunk: string) => (answer += chunk));
    socket.on('error', () => {});
    socket.on('close', () => {
      clearTimeout(giveUp);
      resolve({ answer, closedAfterMs: performance.now() - startedAt });
    });
    socket.write(head + bodyPart);
  });
}

describe('request limits and security headers (e2e)', () => {
  let app: INestApplication;
  let port: number;
  let previousTimeout: string | undefined;

  beforeAll(async () => {
    previousTimeout = process.env.HTTP_REQUEST_TIMEOUT_SECONDS;
    // a short body deadline keeps the stalled-upload test quick; the default is 30 s
    process.env.HTTP_REQUEST_TIMEOUT_SECONDS = '1';
    app = await createTestApp();
    const server = app.getHttpServer() as Server;
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    port = (server.address() as AddressInfo).port;
  });

  afterAll(async () => {
    await app?.close();
    if (previousTimeout === undefined) delete process.env.HTTP_REQUEST_TIMEOUT_SECONDS;
    else process.env.HTTP_REQUEST_TIMEOUT_SECONDS = previousTimeout;
  });

  it('refuses a declared 100 MB body with 413 before reading it, and closes the connection', async () => {
    const head = [
      'POST /api/auth/login HTTP/1.1',
      'Host: 127.0.0.1',
      'Content-Type: application/json',
      `Content-Length: ${100 * 1024 * 1024}`,
      '',
      '',
    ].join('\r\n');
    // Only a few bytes of the 100 MB ever arrive: before the fix the server waited for the rest.
    const { answer, closedAfterMs } = await rawExchange(port, head, '{"email":', 5000);
    expect(answer).toMatch(/^HTTP\/1\.1 413 /);
    expect(answer).toContain('over the limit of 1048576 bytes');
    expect(closedAfterMs).toBeLessThan(2000);
  });

  it('drops a body that stalls past the request deadline with 408', async () => {
    const head = ['POST /api/auth/login HTTP/1.1', 'Host: 127.0.0.1', 'Content-Type: application/json', 'Content-Length: 100', '', ''].join('\r\n');
    const { answer, closedAfterMs } = await rawExchange(port, head, '{"email":"a', 6000);
    expect(answer).toMatch(/^HTTP\/1\.1 408 /);
    expect(closedAfterMs).toBeGreaterThanOrEqual(900);
    expect(closedAfterMs).toBeLessThan(4000);
  });

  it('still reads an ordinary body under the limit', async () => {
    const response = await request(app.getHttpServer()).post('/api/auth/login').send({ email: 'nobody@example.test', password: 'wrong-password' });
    expect([400, 401]).toContain(response.status);
  });

  it('refuses a Content-Length that is not a byte count', async () => {
    const head = ['POST /api/auth/login HTTP/1.1', 'Host: 127.0.0.1', 'Content-Type: application/json', 'Content-Length: -5', '', ''].join('\r\n');
    const { answer } = await rawExchange(port, head, '', 5000);
    // Node's HTTP parser may refuse it first (400 Bad Request); either way it is a 400, never a 5xx
    expect(answer).toMatch(/^HTTP\/1\.1 400 /);
  });

  it('sends the security headers on API answers, with no-store and no HSTS by default', async () => {
    const response = await request(app.getHttpServer()).get('/api/health').expect(200);
    const csp = response.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).not.toContain('unsafe-inline');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['x-frame-options']).toBe('DENY');
    expect(response.headers['referrer-policy']).toBe('no-referrer');
    expect(response.headers['permissions-policy']).toContain('camera=()');
    expect(response.headers['cache-control']).toBe('no-store');
    expect(response.headers['strict-transport-security']).toBeUndefined();
    expect(response.headers['x-powered-by']).toBeUndefined();
  });

  it('keeps no-store on error answers too', async () => {
    const response = await request(app.getHttpServer()).get('/api/links').expect(401);
    expect(response.headers['cache-control']).toBe('no-store');
    expect(response.headers['content-security-policy']).toContain("frame-ancestors 'none'");
  });
});
