import 'reflect-metadata';
import type { INestApplication } from '@nestjs/common';
import { Test } from '@nestjs/testing';
import { AppModule } from '../../src/app.module.js';
import { configureApp } from '../../src/app.setup.js';
import { applyTestEnv } from './test-env.js';

/** The real application (same modules, guards, filter and body parsing as main.ts), not listening. */
export async function createTestApp(): Promise<INestApplication> {
  applyTestEnv();
  const moduleRef = await Test.createTestingModule({ imports: [AppModule] }).compile();
  const app = moduleRef.createNestApplication({ bodyParser: false, logger: ['error', 'warn'] });
  configureApp(app);
  await app.init();
  return app;
}
