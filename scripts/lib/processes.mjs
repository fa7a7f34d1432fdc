// Child processes: step headings, commands in their own process group, and waiting for a server.
// Plain ESM with node built-ins only: it runs before `npm ci` on a fresh clone.

import { spawn } from 'node:child_process';
import { ROOT_DIR } from './paths.mjs';

/** Prints a step heading. */
export function step(message) {
  process.stdout.write(`\n\u25b6 ${message}\n`);
}

/**
 * Runs a command to completion. Output goes to our terminal (and is collected when `capture`).
 * `detached` puts the child in its own process group, so that `killGroup` can end it with all of
 * its children (npm -> sh -> node -> workers) on a timeout or Ctrl-C.
 * @param {string} command
 * @param {string[]} args
 * @param {{ cwd?: string, env?: NodeJS.ProcessEnv, capture?: boolean, quiet?: boolean, timeoutMs?: number,
 *   onSpawn?: (child: import('node:child_process').ChildProcess) => void }} [options]
 * @returns {Promise<{ code: number, output: string, timedOut: boolean, durationMs: number }>}
 */
export function runCommand(command, args, { cwd = ROOT_DIR, env = process.env, capture = false, quiet = false, timeoutMs, onSpawn } = {}) {
  const startedAt = Date.now();
  if (refuseNewChildren) {
    return Promise.resolve({ code: 130, output: '', timedOut: false, durationMs: 0, interrupted: true });
  }
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, {
      cwd, env, detached: true, stdio: ['ignore', capture || quiet ? 'pipe' : 'inherit', capture || quiet ? 'pipe' : 'inherit'],
    });
    runningChildren.add(child);
    onSpawn?.(child);
    let output = '';
    const collect = (target) => (chunk) => {
      output += chunk;
      if (!quiet) target.write(chunk);
    };
    child.stdout?.on('data', collect(process.stdout));
    child.stderr?.on('data', collect(process.stderr));
    let timedOut = false;
    const timer = timeoutMs ? setTimeout(() => { timedOut = true; killGroup(child, 'SIGKILL'); }, timeoutMs) : undefined;
    child.once('error', (error) => { clearTimeout(timer); reject(error); });
    child.once('close', (code, signal) => {
      runningChildren.delete(child);
      clearTimeout(timer);
      resolve({ code: code ?? (signal ? 128 : 1), output, timedOut, durationMs: Date.now() - startedAt });
    });
  });
}

const runningChildren = new Set();
let refuseNewChildren = false;

/**
 * Ends every command started through runCommand that still runs, with its whole process group
 * (they are detached, so a Ctrl-C in the terminal reaches only us: we pass it on here), and makes
 * runCommand refuse new ones from then on, so that a script winding down starts nothing new.
 */
export function killRunningChildren(signal = 'SIGTERM') {
  refuseNewChildren = true;
  for (const child of runningChildren) killGroup(child, signal);
}

// Last resort: a detached child must never outlive us (process.kill is synchronous).
process.on('exit', () => {
  for (const child of runningChildren) killGroup(child, 'SIGKILL');
});

/** Sends a signal to a detached child's whole process group (falls back to the child alone). */
export function killGroup(child, signal = 'SIGTERM') {
  if (!child || child.exitCode !== null || child.signalCode !== null) return;
  try {
    process.kill(-child.pid, signal);
  } catch {
    try { child.kill(signal); } catch { /* already gone */ }
  }
}

/**
 * Polls GET `url` until it answers 2xx with a JSON body that `accept` approves, the child exits,
 * or the time runs out.
 * @returns {Promise<object>} the last JSON body
 */
export async function waitForHealth(url, { child, timeoutMs = 60_000, accept = (body) => body?.status === 'ok' || body?.database === 'up' } = {}) {
  const deadline = Date.now() + timeoutMs;
  let last = 'no answer yet';
  while (Date.now() < deadline) {
    if (child && (child.exitCode !== null || child.signalCode !== null)) {
      throw new Error(`the server exited (code ${child.exitCode ?? child.signalCode}) before ${url} answered`);
    }
    try {
      const response = await fetch(url, { signal: AbortSignal.timeout(2000) });
      const text = await response.text();
      last = `${response.status} ${text.slice(0, 200)}`;
      if (response.ok) {
        const body = JSON.parse(text);
        if (accept(body)) return body;
      }
    } catch (error) {
      last = error.cause?.code ?? error.message;
    }
    await new Promise((resolve) => setTimeout(resolve, 300));
  }
  throw new Error(`${url} did not report healthy within ${Math.round(timeoutMs / 1000)} s (last: ${last})`);
}
