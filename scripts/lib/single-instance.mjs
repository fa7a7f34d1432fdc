// A pid lock file that keeps a second `npm start` of the same checkout from touching the running
// one's database. Created atomically (O_EXCL); a lock whose process is gone (a run killed with
// kill -9) is stale and replaced.

import fs from 'node:fs';
import path from 'node:path';

/** True when process `pid` is alive (signal 0 checks without touching it). */
export function isProcessAlive(pid) {
  if (!Number.isInteger(pid) || pid <= 0) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return error.code === 'EPERM'; // alive, but someone else's
  }
}

/**
 * Takes the lock for this process.
 * @param {string} lockFile
 * @param {Record<string, unknown>} details stored beside the pid (shown to a second caller)
 * @returns {{ acquired: true } | { acquired: false, holder: { pid: number, startedAt?: string } & Record<string, unknown> }}
 */
export function acquireLock(lockFile, details = {}) {
  fs.mkdirSync(path.dirname(lockFile), { recursive: true });
  for (let attempt = 0; attempt < 3; attempt += 1) {
    try {
      const fd = fs.openSync(lockFile, 'wx', 0o644);
      fs.writeSync(fd, `${JSON.stringify({ pid: process.pid, startedAt: new Date().toISOString(), ...details })}\n`);
      fs.closeSync(fd);
      return { acquired: true };
    } catch (error) {
      if (error.code !== 'EEXIST') throw error;
    }
    let holder = {};
    try {
      holder = JSON.parse(fs.readFileSync(lockFile, 'utf8'));
    } catch {
      // Unreadable or half-written: give a writer that is just creating it a moment.
      if (Date.now() - fs.statSync(lockFile).mtimeMs < 2000) continue;
    }
    if (isProcessAlive(holder.pid)) return { acquired: false, holder };
    fs.rmSync(lockFile, { force: true }); // stale
  }
  return { acquired: false, holder: { pid: -1 } };
}

/** Removes the lock when this process holds it. */
export function releaseLock(lockFile) {
  try {
    const holder = JSON.parse(fs.readFileSync(lockFile, 'utf8'));
    if (holder.pid === process.pid) fs.rmSync(lockFile, { force: true });
  } catch {
    // nothing to release
  }
}
