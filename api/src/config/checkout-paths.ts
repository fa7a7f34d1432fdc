import { existsSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Root of the checkout: this file is api/src/config (source) or api/dist/config (build). */
export const CHECKOUT_ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..', '..');

/** The checkout's .env (settings of a local install); absent on a fresh clone, which is fine. */
export const ENV_FILE = resolve(CHECKOUT_ROOT, '.env');

/** Loads the checkout's .env into process.env without overriding variables that are already set. */
export function loadCheckoutEnvFile(): void {
  if (!existsSync(ENV_FILE)) return;
  const before = { ...process.env };
  process.loadEnvFile(ENV_FILE);
  Object.assign(process.env, before);
}
