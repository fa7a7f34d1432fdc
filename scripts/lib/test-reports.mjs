// Reading test counts back from the runners `npm test` drives. Kept apart from scripts/test.mjs so
// that the counting itself is tested (scripts/lib/test-reports.test.mjs): a summary that miscounts
// would hide failures.

import { stripVTControlCharacters } from 'node:util';

/**
 * @typedef {{ passed: number, failed: number, skipped: number, note: string }} SuiteCounts
 */

/**
 * Counts a vitest run from its JSON report (`--reporter=json --outputFile=...`) and exit code.
 * A file that fails to load has no tests to count, so it counts as one failure; a run that finds
 * no test files, or fails without a readable report, is a failure too, never a silent pass.
 * @param {{ report: any, exitCode: number, output: string, timedOut?: boolean }} run
 *   report: the parsed JSON, or undefined when it could not be read
 * @returns {SuiteCounts}
 */
export function countVitest({ report, exitCode, output, timedOut = false }) {
  const counts = { passed: 0, failed: 0, skipped: 0, note: '' };
  if (report) {
    counts.passed = report.numPassedTests ?? 0;
    counts.failed = report.numFailedTests ?? 0;
    counts.skipped = (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
    const brokenFiles = (report.testResults ?? []).filter(
      (file) => file.status === 'failed' && !(file.assertionResults ?? []).some((test) => test.status === 'failed'),
    );
    if (brokenFiles.length) {
      counts.failed += brokenFiles.length;
      counts.note = `${brokenFiles.length} test file(s) failed to run: ${brokenFiles.map((file) => file.name).join(', ')}`;
    }
  }
  const noFiles = /No test files found/i.test(output) || (report && (report.numTotalTests ?? 0) === 0 && !(report.testResults ?? []).length);
  if (noFiles) {
    counts.failed = Math.max(counts.failed, 1);
    counts.note = 'no test files found in this workspace';
  } else if (timedOut) {
    counts.failed += 1;
    counts.note = 'timed out';
  } else if (exitCode !== 0 && counts.failed === 0) {
    counts.failed = 1;
    counts.note = report ? `vitest exited ${exitCode} although every counted test passed` : `vitest exited ${exitCode} without a readable report`;
  } else if (exitCode === 0 && !report) {
    counts.failed = 1;
    counts.note = 'vitest passed but wrote no JSON report: tests could not be counted';
  }
  return counts;
}

/**
 * Counts node:test results from its closing summary: TAP (`# pass N`, the default when output is
 * not a terminal) or spec (`ℹ pass N`). Several runs in one output are added up. Cancelled tests
 * count as failures, todo as skipped.
 * @param {string} output
 * @returns {{ passed: number, failed: number, skipped: number } | undefined} undefined when no
 *   summary line is there at all (the runner never got to the end)
 */
export function countNodeTestSummary(output) {
  const plain = stripVTControlCharacters(output); // colours of the spec reporter
  const read = (word) => {
    const matches = [...plain.matchAll(new RegExp(`^\\s*(?:#|\u2139)\\s+${word}\\s+(\\d+)\\s*$`, 'gm'))];
    return matches.length ? matches.reduce((sum, match) => sum + Number(match[1]), 0) : undefined;
  };
  const passed = read('pass');
  const failed = read('fail');
  if (passed === undefined && failed === undefined) return undefined;
  return {
    passed: passed ?? 0,
    failed: (failed ?? 0) + (read('cancelled') ?? 0),
    skipped: (read('skipped') ?? 0) + (read('todo') ?? 0),
  };
}
