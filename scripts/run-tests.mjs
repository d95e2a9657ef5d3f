#!/usr/bin/env node
// Runs the whole vitest suite and ends with the plain line "N passed, N failed"
// that CI reads; the exit code is vitest's.
import { spawnSync } from 'node:child_process';
import { readFileSync, rmSync } from 'node:fs';

const out = '.test-results.json';
rmSync(out, { force: true });
const args = ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${out}`, ...process.argv.slice(2)];
const run = spawnSync('npx', args, { stdio: 'inherit' });
let passed = 0;
let failed = 0;
let skipped = 0;
try {
  const report = JSON.parse(readFileSync(out, 'utf8'));
  passed = report.numPassedTests ?? 0;
  failed = report.numFailedTests ?? 0;
  // A test file that failed without any failed test (e.g. it could not be
  // imported) counts as one failure, so a broken file is never invisible.
  for (const file of report.testResults ?? []) {
    const anyFailed = (file.assertionResults ?? []).some((a) => a.status === 'failed');
    if (file.status === 'failed' && !anyFailed) failed++;
  }
  skipped = (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
} catch {
  failed = failed || 1;
}
// vitest can fail outside any test (an unhandled error): never report that as all green.
if (run.status !== 0 && failed === 0) {
  console.log('vitest exited with an error outside the tests (see above)');
  failed = 1;
}
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(run.status ?? 1);
