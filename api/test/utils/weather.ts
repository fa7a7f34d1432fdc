/** Helpers of the weather e2e tests: CSV text, uploads through supertest, waiting for an import. */
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { WeatherImportJobSchema, type WeatherColumnMapping, type WeatherImportJob } from '@beamwright/link-core/contracts';
import { bearer, type TestMember } from './test-organisation.js';

export const HOURLY_MAPPING: WeatherColumnMapping = { timestampColumn: 'time', visibilityColumn: 'visibility_m', visibilityUnit: 'm', visibilityDefinition: 'mor-5-percent' };

/** Hourly rows `time,visibility_m` from a start instant (UTC). */
export function hourlyCsv(startIso: string, visibilitiesM: (number | string)[], header = 'time,visibility_m'): string {
  const start = Date.parse(startIso);
  const lines = visibilitiesM.map((visibility, i) => `${new Date(start + i * 3_600_000).toISOString()},${visibility}`);
  return `${header}\n${lines.join('\n')}\n`;
}

export interface UploadOptions {
  name?: string;
  fileName?: string;
  mapping?: WeatherColumnMapping | string | null;
  onRowErrors?: 'reject' | 'skip';
  siteId?: string;
  prefer?: string;
}

/** A multipart upload as a browser or a script sends it. */
export function uploadWeather(app: INestApplication, member: TestMember, file: Buffer | string, options: UploadOptions = {}) {
  let call = request(app.getHttpServer()).post('/api/weather-datasets').set(...bearer(member));
  if (options.prefer) call = call.set('Prefer', options.prefer);
  call = call.field('name', options.name ?? 'Test records');
  if (options.mapping !== null) call = call.field('mapping', typeof options.mapping === 'string' ? options.mapping : JSON.stringify(options.mapping ?? HOURLY_MAPPING));
  if (options.onRowErrors) call = call.field('onRowErrors', options.onRowErrors);
  if (options.siteId) call = call.field('siteId', options.siteId);
  return call.attach('file', Buffer.isBuffer(file) ? file : Buffer.from(file), options.fileName ?? 'records.csv');
}

/** Polls an import until it has ended (or the time is up). */
export async function waitForImportEnd(app: INestApplication, member: TestMember, jobId: string, timeoutMs = 30_000): Promise<WeatherImportJob> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await request(app.getHttpServer()).get(`/api/weather-datasets/imports/${jobId}`).set(...bearer(member)).expect(200);
    const job = WeatherImportJobSchema.parse(response.body);
    if (job.state === 'succeeded' || job.state === 'failed' || job.state === 'cancelled') return job;
    if (Date.now() > deadline) throw new Error(`import ${jobId} still ${job.state} after ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
