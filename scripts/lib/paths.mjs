// Where things are: the checkout, its git-ignored data folder, the workspaces in build order.
// Plain ESM with node built-ins only: it runs before `npm ci` on a fresh clone.

import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** Absolute path of the checkout (the folder holding the root package.json). */
export const ROOT_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

/** Git-ignored folder for the local cluster, lock file, build stamps and the local JWT secret. */
export const DATA_DIR = path.join(ROOT_DIR, '.data');

/** Workspaces in build order: link-core first (the api imports its dist/). */
export const WORKSPACES = [
  { name: '@beamwright/link-core', dir: 'link-core', output: 'dist/index.js', dependsOn: [] },
  { name: '@beamwright/api', dir: 'api', output: 'dist/main.js', dependsOn: ['@beamwright/link-core'] },
  { name: '@beamwright/ui', dir: 'ui', output: 'dist/index.html', dependsOn: ['@beamwright/link-core'] },
];

/** git-describable short version for banners (best effort). */
export function checkoutVersion() {
  const result = spawnSync('git', ['rev-parse', '--short', 'HEAD'], { cwd: ROOT_DIR, encoding: 'utf8' });
  return result.status === 0 ? result.stdout.trim() : 'unknown';
}
