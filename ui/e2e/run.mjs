// Runs every ui/e2e/*.e2e.mjs file with node's built-in test runner against BASE_URL
// (a running, seeded Beamwright; default http://127.0.0.1:3100). Exits non-zero on failure.
import { readdirSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(here)
  .filter((name) => name.endsWith('.e2e.mjs'))
  .filter((name) => only.length === 0 || only.some((filter) => name.includes(filter)))
  .sort()
  .map((name) => join(here, name));

if (files.length === 0) {
  console.error('no browser tests matched');
  process.exit(1);
}

console.log(`browser tests against ${process.env.BASE_URL ?? 'http://127.0.0.1:3100'}: ${files.length} file(s)`);
// One file at a time: each drives its own chromium and the machine has two cores.
const result = spawnSync(process.execPath, ['--test', '--test-concurrency=1', ...files], { stdio: 'inherit', env: process.env });
process.exit(result.status ?? 1);
