import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HealthResponseSchema } from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { runMigrations } from './utils/migrate.js';
import { startThrowawayPostgres, type ThrowawayPostgres } from './utils/throwaway-postgres.js';

/**
 * The health route against a private cluster that this test stops and starts (the shared test
 * database is never stopped).
 */
describe('GET /api/health (e2e, private database)', () => {
  let database: ThrowawayPostgres;
  let app: INestApplication;
  const saved: Record<string, string | undefined> = {};

  beforeAll(async () => {
    database = await startThrowawayPostgres({ label: 'api-health' });
    const settings = { host: database.host, port: database.port, username: database.user, password: database.password, database: database.database };
    await runMigrations(settings);
    for (const key of ['DATABASE_HOST', 'DATABASE_PORT', 'DATABASE_USER', 'DATABASE_PASSWORD', 'DATABASE_NAME']) saved[key] = process.env[key];
    Object.assign(process.env, {
      DATABASE_HOST: database.host,
      DATABASE_PORT: String(database.port),
      DATABASE_USER: database.user,
      DATABASE_PASSWORD: database.password,
      DATABASE_NAME: database.database,
    });
    app = await createTestApp();
  });

  afterAll(async () => {
    await app?.close();
    await database?.remove();
    for (const [key, value] of Object.entries(saved)) {
      if (value === undefined) delete process.env[key];
      else process.env[key] = value;
    }
  });

  const health = () => request(app.getHttpServer()).get('/api/health');

  it('reports the database up, down quickly while it is stopped, and up again once it is back', async () => {
    const up = await health().expect(200);
    expect(HealthResponseSchema.parse(up.body)).toEqual({ status: 'ok', database: 'up' });

    await database.stop();
    const startedAt = performance.now();
    const down = await health().expect(200);
    const elapsedMs = performance.now() - startedAt;
    expect(down.body).toEqual({ status: 'degraded', database: 'down' });
    expect(elapsedMs).toBeLessThan(5000);
    // the public route keeps answering while the database is away
    await health().expect(200, { status: 'degraded', database: 'down' });

    await database.start();
    // the pool opens fresh connections on demand; allow it a few probes
    let recovered: unknown;
    for (let attempt = 0; attempt < 10; attempt += 1) {
      recovered = (await health().expect(200)).body;
      if ((recovered as { database: string }).database === 'up') break;
      await new Promise((resolve) => setTimeout(resolve, 300));
    }
    expect(recovered).toEqual({ status: 'ok', database: 'up' });
  });
});
