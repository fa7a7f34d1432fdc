// Incremental builds: a workspace is rebuilt only when its inputs changed since its last build.
// Plain ESM with node built-ins only: it runs before `npm ci` on a fresh clone.

import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { DATA_DIR, ROOT_DIR, WORKSPACES } from './paths.mjs';
import { runCommand, step } from './processes.mjs';

const SKIPPED_FOLDERS = new Set(['node_modules', 'dist', 'coverage', '.vite', 'artifacts', '.turbo']);

/** Every input file of a workspace with its size and mtime, sorted, as one fingerprint. */
function fingerprintFolder(dir) {
  const entries = [];
  const walk = (current) => {
    for (const entry of fs.readdirSync(current, { withFileTypes: true })) {
      if (entry.isDirectory()) {
        if (!SKIPPED_FOLDERS.has(entry.name)) walk(path.join(current, entry.name));
      } else if (entry.isFile()) {
        const file = path.join(current, entry.name);
        const stat = fs.statSync(file);
        entries.push(`${path.relative(ROOT_DIR, file)}\t${stat.size}\t${stat.mtimeMs}`);
      }
    }
  };
  walk(dir);
  return entries.sort().join('\n');
}

/**
 * Fingerprint of what a workspace's build depends on: its own files, the workspaces it depends on,
 * the base tsconfig and the lockfile. Equal fingerprints mean the last build output is current.
 */
export function buildFingerprint(workspace) {
  const hash = createHash('sha256');
  for (const shared of ['tsconfig.base.json', 'package-lock.json']) {
    const file = path.join(ROOT_DIR, shared);
    if (fs.existsSync(file)) hash.update(fs.readFileSync(file));
  }
  for (const name of [...workspace.dependsOn, workspace.name]) {
    const dependency = WORKSPACES.find((candidate) => candidate.name === name);
    hash.update(fingerprintFolder(path.join(ROOT_DIR, dependency.dir)));
  }
  return hash.digest('hex');
}

const STAMP_FILE = path.join(DATA_DIR, 'build-stamps.json');

function readStamps() {
  try {
    return JSON.parse(fs.readFileSync(STAMP_FILE, 'utf8'));
  } catch {
    return {};
  }
}

/**
 * Builds the workspaces in order, skipping one whose inputs are unchanged since its last
 * successful build through this script (and whose output still exists). `force` builds all.
 * @param {{ env?: NodeJS.ProcessEnv, force?: boolean, only?: string[] }} [options]
 */
export async function buildWorkspaces({ env = process.env, force = false, only } = {}) {
  const stamps = readStamps();
  for (const workspace of WORKSPACES) {
    if (only && !only.includes(workspace.name)) continue;
    const fingerprint = buildFingerprint(workspace);
    const outputExists = fs.existsSync(path.join(ROOT_DIR, workspace.dir, workspace.output));
    if (!force && outputExists && stamps[workspace.name] === fingerprint) {
      process.stdout.write(`  ${workspace.name}: up to date, build skipped\n`);
      continue;
    }
    step(`Building ${workspace.name}`);
    const result = await runCommand('npm', ['run', 'build', '-w', workspace.name], { env });
    if (result.code !== 0) throw new Error(`The build of ${workspace.name} failed (exit ${result.code}); see the output above.`);
    stamps[workspace.name] = fingerprint;
    fs.mkdirSync(DATA_DIR, { recursive: true });
    fs.writeFileSync(STAMP_FILE, `${JSON.stringify(stamps, null, 2)}\n`);
  }
}
