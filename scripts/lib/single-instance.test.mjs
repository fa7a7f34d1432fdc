// Run: node --test scripts/lib/single-instance.test.mjs
import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, beforeEach, test } from 'node:test';
import { acquireLock, isProcessAlive, releaseLock } from './single-instance.mjs';

let dir;
let lockFile;
beforeEach(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'bw-lock-'));
  lockFile = path.join(dir, 'nested', 'start.lock');
});
afterEach(() => fs.rmSync(dir, { recursive: true, force: true }));

/** The pid of a process that has already exited. */
function deadPid() {
  const child = spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' });
  return Number(child.stdout);
}

test('the first caller gets the lock, with its pid and details on record', () => {
  assert.deepEqual(acquireLock(lockFile, { url: 'http://127.0.0.1:3000' }), { acquired: true });
  const record = JSON.parse(fs.readFileSync(lockFile, 'utf8'));
  assert.equal(record.pid, process.pid);
  assert.equal(record.url, 'http://127.0.0.1:3000');
});

test('a second caller is refused while the holder lives, and told who holds it', () => {
  fs.mkdirSync(path.dirname(lockFile), { recursive: true });
  // The parent of this test process stands in for another running `npm start`.
  fs.writeFileSync(lockFile, JSON.stringify({ pid: process.ppid, startedAt: 'earlier', url: 'http://127.0.0.1:3000' }));
  const result = acquireLock(lockFile, {});
  assert.equal(result.acquired, false);
  assert.equal(result.holder.pid, process.ppid);
  assert.equal(result.holder.url, 'http://127.0.0.1:3000');
  releaseLock(lockFile); // not ours: must stay
  assert.ok(fs.existsSync(lockFile));
});

test('a lock left by a process that died is replaced', () => {
  const pid = deadPid();
  assert.equal(isProcessAlive(pid), false);
  fs.mkdirSync(path.dirname(lockFile), { recursive: true });
  fs.writeFileSync(lockFile, JSON.stringify({ pid }));
  assert.deepEqual(acquireLock(lockFile), { acquired: true });
  assert.equal(JSON.parse(fs.readFileSync(lockFile, 'utf8')).pid, process.pid);
});

test('releaseLock removes our own lock', () => {
  acquireLock(lockFile);
  releaseLock(lockFile);
  assert.equal(fs.existsSync(lockFile), false);
});
