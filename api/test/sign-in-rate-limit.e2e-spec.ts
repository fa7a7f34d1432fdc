import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TooManyRequestsBodySchema } from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { createTestOrganisation, TEST_PASSWORD, type TestOrganisation } from './utils/test-organisation.js';

/**
 * Sign-in throttling against the real database. Small limits so the tests stay short; two app
 * instances on one database stand for two API processes. The first instance trusts one proxy hop
 * so each test can speak from its own documentation-range address (RFC 5737) through
 * X-Forwarded-For; the second keeps the default (no proxy trusted) and so sees the socket address.
 */
const ACCOUNT_LIMIT = 3;
const ADDRESS_LIMIT = 5;
const WINDOW_S = 15 * 60;
const LIMITS = {
  SIGN_IN_MAX_ATTEMPTS_PER_ACCOUNT: String(ACCOUNT_LIMIT),
  SIGN_IN_MAX_ATTEMPTS_PER_ADDRESS: String(ADDRESS_LIMIT),
  SIGN_IN_ATTEMPT_WINDOW: '15m',
};

describe('sign-in rate limiting (e2e)', () => {
  let proxied: INestApplication;
  let direct: INestApplication;
  let org: TestOrganisation;
  let others: TestOrganisation;

  async function clearCounters() {
    await proxied.get(DataSource).query('DELETE FROM rate_limit_counter');
  }

  beforeAll(async () => {
    proxied = await createTestApp({ env: { ...LIMITS, TRUST_PROXY_HOPS: '1' } });
    direct = await createTestApp({ env: LIMITS });
    // failed sign-ins of earlier test files (under their generous limits) count here too: start clean
    await clearCounters();
    // the organisations sign their members in once each (successful sign-ins give their count back)
    org = await createTestOrganisation(proxied, 'throttle');
    others = await createTestOrganisation(proxied, 'throttle-b');
    await clearCounters();
  });

  afterAll(async () => {
    // a block left behind would refuse the sign-ins of the test files that run after this one
    if (proxied) await clearCounters();
    await org?.remove();
    await others?.remove();
    await proxied?.close();
    await direct?.close();
  });

  const signIn = (app: INestApplication, email: string, password: string, fromAddress?: string) => {
    const call = request(app.getHttpServer()).post('/api/auth/login');
    if (fromAddress) call.set('X-Forwarded-For', fromAddress);
    return call.send({ email, password });
  };

  function expectThrottled(response: request.Response) {
    expect(response.status).toBe(429);
    const retryAfterS = Number(response.headers['retry-after']);
    expect(Number.isInteger(retryAfterS)).toBe(true);
    expect(retryAfterS).toBeGreaterThan(WINDOW_S - 60);
    expect(retryAfterS).toBeLessThanOrEqual(WINDOW_S);
    const body = TooManyRequestsBodySchema.parse(response.body);
    expect(body).toMatchObject({ statusCode: 429, error: 'Too Many Requests', retryAfterS });
    expect(body.message).toBe('Too many sign-in attempts. Try again in 15 minutes.');
    expect(response.body).not.toHaveProperty('accessToken');
  }

  it('answers the guess after the limit with 429 and Retry-After, whatever the letter case or the address', async () => {
    const email = org.members.engineer.email;
    // letter case and spaces are variants of one account
    const variants = [email, email.toUpperCase(), `  ${email}  `];
    for (const variant of variants) {
      await signIn(proxied, variant, 'wrong-guess', '203.0.113.10').expect(401);
    }
    expectThrottled(await signIn(proxied, email.toUpperCase(), 'wrong-guess', '203.0.113.10'));
    // the account stays closed from another address, and to the right password too
    expectThrottled(await signIn(proxied, email, TEST_PASSWORD, '203.0.113.11'));
    // another account from the same address is not affected by this account's limit
    await signIn(proxied, org.members.reviewer.email, TEST_PASSWORD, '203.0.113.10').expect(200);
  });

  it('lets other accounts from one address through until the address limit, then refuses every account there', async () => {
    const address = '203.0.113.20';
    const first = org.members.installer.email;
    const second = others.members.engineer.email;
    for (let attempt = 0; attempt < ACCOUNT_LIMIT; attempt += 1) await signIn(proxied, first, 'wrong-guess', address).expect(401);
    // address count is 3 of 5: a different account still gets an answer
    await signIn(proxied, second, 'wrong-guess', address).expect(401);
    await signIn(proxied, second, 'wrong-guess', address).expect(401);
    // the sixth attempt from this address is refused, for any account
    expectThrottled(await signIn(proxied, second, 'wrong-guess', address));
    expectThrottled(await signIn(proxied, others.members.admin.email, TEST_PASSWORD, address));
    // the refused attempts did not count against the second account: from elsewhere it signs in
    await signIn(proxied, second, TEST_PASSWORD, '203.0.113.21').expect(200);
  });

  it('does not count successful sign-ins, so a member can sign in again and again', async () => {
    for (let attempt = 0; attempt < ADDRESS_LIMIT + 2; attempt += 1) {
      await signIn(proxied, others.members.reviewer.email, TEST_PASSWORD, '203.0.113.30').expect(200);
    }
  });

  it('keeps the counters in PostgreSQL: a second API instance on the same database refuses the same account', async () => {
    const email = others.members.installer.email;
    for (let attempt = 0; attempt < ACCOUNT_LIMIT; attempt += 1) await signIn(proxied, email, 'wrong-guess', '203.0.113.40').expect(401);
    expectThrottled(await signIn(direct, email, 'wrong-guess'));

    const rows: Array<{ throttler: string; hits: number }> = await direct.get(DataSource).query(
      'SELECT throttler, hits FROM rate_limit_counter WHERE blocked_until > now() ORDER BY throttler',
    );
    // neither the e-mail nor the address is stored in clear: keys are hashes
    const keys: Array<{ key: string }> = await direct.get(DataSource).query('SELECT key FROM rate_limit_counter');
    expect(rows).toContainEqual({ throttler: 'sign-in-account', hits: ACCOUNT_LIMIT + 1 });
    expect(keys.some(({ key }) => key.includes(email) || key.includes('203.0.113'))).toBe(false);
  });

  it('takes the client address from the connection unless a proxy is trusted (X-Forwarded-For ignored by default)', async () => {
    await clearCounters();
    const accounts = [org.members.admin.email, others.members.admin.email, 'nobody-1@throttle.test', 'nobody-2@throttle.test', 'nobody-3@throttle.test'];
    // five accounts, five claimed addresses, one real address: five attempts of five allowed
    for (const [index, email] of accounts.entries()) {
      await signIn(direct, email, 'wrong-guess', `198.51.100.${index + 1}`).expect(401);
    }
    expectThrottled(await signIn(direct, 'nobody-4@throttle.test', 'wrong-guess', '198.51.100.99'));
  });

  it('limits only sign-in: other routes answer as usual from a refused address', async () => {
    await request(direct.getHttpServer()).get('/api/health').expect(200);
    await request(direct.getHttpServer()).get('/api/sites').expect(401);
  });
});
