import type { INestApplication } from '@nestjs/common';
import { randomBytes } from 'node:crypto';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PostgresThrottlerStorage } from '../src/rate-limits/postgres-throttler.storage.js';
import { createTestApp } from './utils/test-app.js';

/** The throttler storage over PostgreSQL on its own: atomic counting, blocking, expiry and sweeping. */
describe('PostgresThrottlerStorage (e2e, real database)', () => {
  let app: INestApplication;
  let storage: PostgresThrottlerStorage;
  const keys: string[] = [];
  const newKey = () => {
    const key = `test-${randomBytes(8).toString('hex')}`;
    keys.push(key);
    return key;
  };

  beforeAll(async () => {
    app = await createTestApp();
    storage = app.get(PostgresThrottlerStorage);
  });

  afterAll(async () => {
    if (keys.length > 0) await app.get(DataSource).query('DELETE FROM rate_limit_counter WHERE key = ANY($1)', [keys]);
    await app?.close();
  });

  it('counts concurrent hits exactly: of 20 at once with a limit of 5, 5 pass and 15 are refused', async () => {
    const key = newKey();
    const records = await Promise.all(Array.from({ length: 20 }, () => storage.increment(key, 60_000, 5, 60_000, 'test')));
    expect(records.filter((record) => !record.isBlocked)).toHaveLength(5);
    expect(records.filter((record) => record.isBlocked)).toHaveLength(15);
    // the hit that went over the limit is counted once; refused hits while blocked are not
    const [row] = await app.get(DataSource).query('SELECT hits FROM rate_limit_counter WHERE key = $1', [key]);
    expect(row.hits).toBe(6);
    for (const record of records.filter((r) => r.isBlocked)) {
      expect(record.timeToBlockExpire).toBeGreaterThan(58);
      expect(record.timeToBlockExpire).toBeLessThanOrEqual(60);
    }
  });

  it('starts afresh once the window is over, and sweeps counters that have ended', async () => {
    const key = newKey();
    await storage.increment(key, 200, 1, 200, 'test');
    expect((await storage.increment(key, 200, 1, 200, 'test')).isBlocked).toBe(true);
    await new Promise((resolve) => setTimeout(resolve, 350));
    const again = await storage.increment(key, 200, 1, 200, 'test');
    expect(again).toMatchObject({ totalHits: 1, isBlocked: false, timeToBlockExpire: 0 });

    await new Promise((resolve) => setTimeout(resolve, 350));
    expect(await storage.sweep()).toBeGreaterThanOrEqual(1);
    const rows = await app.get(DataSource).query('SELECT 1 FROM rate_limit_counter WHERE key = $1', [key]);
    expect(rows).toHaveLength(0);
  });

  it('gives back one hit of an unblocked key, never one of a blocked key', async () => {
    const key = newKey();
    await storage.increment(key, 60_000, 2, 60_000, 'test');
    await storage.increment(key, 60_000, 2, 60_000, 'test');
    await storage.forgive(key);
    expect((await storage.increment(key, 60_000, 2, 60_000, 'test')).isBlocked).toBe(false);
    expect((await storage.increment(key, 60_000, 2, 60_000, 'test')).isBlocked).toBe(true);
    await storage.forgive(key);
    expect((await storage.increment(key, 60_000, 2, 60_000, 'test')).isBlocked).toBe(true);
  });
});
