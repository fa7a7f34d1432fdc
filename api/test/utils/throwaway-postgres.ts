/**
 * Typed access to the platform's throwaway-cluster helper (scripts/lib/postgres.mjs), for tests
 * that must stop and start a database of their own without touching the shared test database.
 */
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { CHECKOUT_ROOT } from '../../src/config/checkout-paths.js';

export interface ThrowawayPostgres {
  host: string;
  port: number;
  user: string;
  password: string;
  database: string;
  dataDir: string;
  stop(): Promise<void>;
  start(): Promise<void>;
  remove(): Promise<void>;
}

export async function startThrowawayPostgres(options: { port?: number; label?: string } = {}): Promise<ThrowawayPostgres> {
  const helper = (await import(pathToFileURL(resolve(CHECKOUT_ROOT, 'scripts', 'lib', 'postgres.mjs')).href)) as {
    startThrowawayPostgres(options: { port?: number; label?: string }): Promise<ThrowawayPostgres>;
  };
  return helper.startThrowawayPostgres(options);
}
