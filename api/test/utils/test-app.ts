import 'reflect-metadata';
import type { INestApplication } from '@nestjs/common';
import { Test } from '@nestjs/testing';
import { AppModule } from '../../src/app.module.js';
import { configureApp } from '../../src/app.setup.js';
import { applyTestEnv } from './test-env.js';

export interface TestAppOptions {
  /** settings for this instance only (read while the app is built, restored afterwards) */
  env?: Record<string, string>;
}

/** The real application (same modules, guards, filter and body parsing as main.ts), not listening. */
export async function createTestApp(options: TestAppOptions = {}): Promise<INestApplication> {
  applyTestEnv();
  const saved = Object.fromEntries(Object.keys(options.env ?? {}).map((key) => [key, process.env[key]]));
  Object.assign(process.env, options.env);
  try {
    const moduleRef = await Test.createTestingModule({ imports: [AppModule] }).compile();
    const app = moduleRef.createNestApplication({ bodyParser: false, logger: ['error', 'warn'] });
    configureApp(app);
    await app.init();
    return app;
  } finally {
    for (const [key, value] of Object.entries(saved)) {
      if (value === undefined) delete process.env[key];
      else process.env[key] = value;
    }
  }
}
