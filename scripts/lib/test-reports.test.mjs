// Run: node --test scripts/lib/test-reports.test.mjs
import assert from 'node:assert/strict';
import { test } from 'node:test';
import { countNodeTestSummary, countVitest } from './test-reports.mjs';

const vitestReport = (overrides = {}) => ({
  numTotalTests: 5, numPassedTests: 4, numFailedTests: 1, numPendingTests: 1, numTodoTests: 0,
  testResults: [
    { name: '/w/a.test.ts', status: 'failed', assertionResults: [{ status: 'passed' }, { status: 'failed' }] },
    { name: '/w/b.test.ts', status: 'passed', assertionResults: [{ status: 'passed' }] },
  ],
  ...overrides,
});

test('vitest: passed, failed and skipped come from the JSON report', () => {
  assert.deepEqual(countVitest({ report: vitestReport(), exitCode: 1, output: '' }), { passed: 4, failed: 1, skipped: 1, note: '' });
});

test('vitest: a file that fails to load counts as a failure even with no failed test', () => {
  const report = vitestReport({
    numFailedTests: 0,
    testResults: [{ name: '/w/broken.test.ts', status: 'failed', assertionResults: [] }],
  });
  const counts = countVitest({ report, exitCode: 1, output: '' });
  assert.equal(counts.failed, 1);
  assert.match(counts.note, /1 test file\(s\) failed to run: \/w\/broken.test.ts/);
});

test('vitest: no test files is reported as a failure, not a pass', () => {
  const report = { numTotalTests: 0, numPassedTests: 0, numFailedTests: 0, numPendingTests: 0, numTodoTests: 0, testResults: [] };
  const counts = countVitest({ report, exitCode: 1, output: 'No test files found, exiting with code 1' });
  assert.deepEqual(counts, { passed: 0, failed: 1, skipped: 0, note: 'no test files found in this workspace' });
});

test('vitest: a non-zero exit with nothing counted as failed still fails', () => {
  const report = vitestReport({ numFailedTests: 0, testResults: [] });
  assert.equal(countVitest({ report, exitCode: 1, output: '' }).failed, 1);
  assert.equal(countVitest({ report: undefined, exitCode: 2, output: '' }).failed, 1);
  assert.equal(countVitest({ report: undefined, exitCode: 0, output: '' }).failed, 1);
  assert.equal(countVitest({ report, exitCode: 137, output: '', timedOut: true }).note, 'timed out');
});

test('node:test: TAP summary lines', () => {
  const output = 'TAP version 13\nok 1 - signs in\nnot ok 2 - opens a link\n1..2\n# tests 3\n# suites 0\n# pass 1\n# fail 1\n# cancelled 1\n# skipped 0\n# todo 1\n';
  assert.deepEqual(countNodeTestSummary(output), { passed: 1, failed: 2, skipped: 1 });
});

test('node:test: spec summary lines, with colours, added over several runs', () => {
  const run = (pass, fail) => `\u001b[34m\u2139 tests ${pass + fail}\u001b[39m\n\u001b[34m\u2139 pass ${pass}\u001b[39m\n\u001b[34m\u2139 fail ${fail}\u001b[39m\n`;
  assert.deepEqual(countNodeTestSummary(run(3, 0) + run(2, 1)), { passed: 5, failed: 1, skipped: 0 });
});

test('node:test: no summary at all is undefined (the runner did not finish)', () => {
  assert.equal(countNodeTestSummary('browser tests against http://127.0.0.1:3100: 2 file(s)\n'), undefined);
  // A test *named* "pass 3" is not a summary line.
  assert.equal(countNodeTestSummary('ok 1 - # pass 3 is not a summary\n'), undefined);
});
