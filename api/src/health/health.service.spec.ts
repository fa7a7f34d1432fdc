import { Test } from '@nestjs/testing';
import { getDataSourceToken } from '@nestjs/typeorm';
import { describe, expect, it } from 'vitest';
import { HealthService } from './health.service.js';

async function serviceWith(query: () => Promise<unknown>) {
  const moduleRef = await Test.createTestingModule({
    providers: [HealthService, { provide: getDataSourceToken(), useValue: { query } }],
  }).compile();
  return moduleRef.get(HealthService);
}

describe('HealthService', () => {
  it('reports up when the probe answers', async () => {
    const health = await serviceWith(async () => [{ '?column?': 1 }]);
    await expect(health.check()).resolves.toEqual({ status: 'ok', database: 'up' });
  });

  it('reports down when the probe fails', async () => {
    const health = await serviceWith(async () => {
      throw new Error('connect ECONNREFUSED 127.0.0.1:5432');
    });
    await expect(health.check()).resolves.toEqual({ status: 'degraded', database: 'down' });
  });

  it('reports down within its time limit when the database never answers (a hung host)', async () => {
    const health = await serviceWith(() => new Promise(() => {}));
    const startedAt = performance.now();
    await expect(health.check()).resolves.toEqual({ status: 'degraded', database: 'down' });
    expect(performance.now() - startedAt).toBeLessThan(3000);
  });
});
