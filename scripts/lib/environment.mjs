// The settings `npm start` and `npm test` pass to the api: local defaults, .env, the local secret.
// Plain ESM with node built-ins only: it runs before `npm ci` on a fresh clone.

import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { DATA_DIR, ROOT_DIR } from './paths.mjs';

/**
 * Local defaults of every setting the api reads: the api's own list (its env schema reads the same
 * file), documented in .env.example.
 */
export const DEFAULT_ENV = JSON.parse(fs.readFileSync(path.join(ROOT_DIR, 'api', 'src', 'config', 'env-defaults.json'), 'utf8'));

/** The four demo sign-ins seeded by the api (fixtures/demo). */
export const DEMO_USERS = [
  { email: 'admin@demo.test', role: 'admin' },
  { email: 'engineer@demo.test', role: 'engineer' },
  { email: 'reviewer@demo.test', role: 'reviewer' },
  { email: 'installer@demo.test', role: 'installer' },
];

/** Loads the root `.env` when present (it never overrides variables already set). */
export function loadDotEnv() {
  const file = path.join(ROOT_DIR, '.env');
  if (!fs.existsSync(file)) return false;
  process.loadEnvFile(file);
  return true;
}

/**
 * A JWT secret for local runs that stays the same across restarts (so sign-ins survive) but is
 * never a value committed anywhere: generated once into .data/jwt-secret (mode 0600).
 */
export function localJwtSecret() {
  const file = path.join(DATA_DIR, 'jwt-secret');
  if (fs.existsSync(file)) return fs.readFileSync(file, 'utf8').trim();
  fs.mkdirSync(DATA_DIR, { recursive: true });
  const secret = randomBytes(32).toString('base64url');
  fs.writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}
