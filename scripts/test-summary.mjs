// Adds up the Vitest JSON reports of the unit, api, e2e and load runs and prints one closing line.
import { readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';

const [dir, failedSteps = '0'] = process.argv.slice(2);
let passed = 0;
let failed = 0;
let skipped = 0;
for (const project of ['unit', 'api', 'e2e', 'load']) {
  const file = join(dir, `${project}.json`);
  if (!existsSync(file)) {
    console.log(`${project}: no report (the run did not finish)`);
    failed += 1;
    continue;
  }
  const r = JSON.parse(readFileSync(file, 'utf8'));
  const suitesFailed = (r.testResults ?? []).filter((t) => t.status === 'failed' && (t.assertionResults ?? []).length === 0).length;
  console.log(`${project}: ${r.numPassedTests} passed, ${r.numFailedTests} failed, ${r.numPendingTests} skipped` + (suitesFailed ? ` (${suitesFailed} files failed to load)` : ''));
  passed += r.numPassedTests;
  failed += r.numFailedTests + suitesFailed;
  skipped += r.numPendingTests;
}
const steps = Number(failedSteps);
if (steps > 0) console.log(`${steps} step(s) failed (see above)`);
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(failed > 0 || steps > 0 ? 1 : 0);
