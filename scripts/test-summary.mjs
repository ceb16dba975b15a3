// Prints the suite's closing line "N passed, N failed" from the vitest JSON reports.
// A failed step that reported no failed test (type check, lint, build, a test file that did not load)
// counts as one failure.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';

const [dir, , ...failedSteps] = process.argv.slice(2);
const reports = { 'unit tests': 'unit.json', 'API tests': 'api.json', 'browser tests': 'e2e.json' };
let passed = 0;
let failed = 0;
const failedByReport = {};
for (const [step, file] of Object.entries(reports)) {
  const p = path.join(dir, file);
  if (!existsSync(p)) continue;
  const r = JSON.parse(readFileSync(p, 'utf8'));
  passed += r.numPassedTests ?? 0;
  failed += r.numFailedTests ?? 0;
  failedByReport[step] = r.numFailedTests ?? 0;
}
const steps = failedSteps.filter(Boolean);
for (const s of steps) if (!failedByReport[s]) failed += 1;
if (steps.length) console.log(`failed steps: ${steps.join('; ')}`);
console.log(`${passed} passed, ${failed} failed`);
