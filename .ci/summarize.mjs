// Prints the closing line CI reads from one or more vitest JSON reports:
//   node .ci/summarize.mjs [report.json ...]        (default .ci/out/vitest.json)
// With several reports, one line per report comes first and the closing line adds them all up.
// A test file that failed outside any test (a failing beforeAll, an import error) counts as one
// failure: vitest reports its tests as skipped and its own numFailedTests stays 0.
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';

const files = process.argv.length > 2 ? process.argv.slice(2) : ['.ci/out/vitest.json'];
const total = { passed: 0, failed: 0, skipped: 0, tests: 0 };
let ok = true;
for (const file of files) {
  let report;
  try {
    report = JSON.parse(readFileSync(file, 'utf8'));
  } catch (error) {
    console.error(`summarize: cannot read ${file}: ${error.message}`);
    ok = false;
    continue;
  }
  const brokenFiles = (report.testResults ?? []).filter(
    (r) => r.status === 'failed' && !(r.assertionResults ?? []).some((a) => a.status === 'failed'),
  );
  for (const r of brokenFiles) console.error(`summarize: ${r.name} failed outside its tests: ${(r.message || 'see the log above').split('\n')[0]}`);
  const counts = {
    passed: report.numPassedTests ?? 0,
    failed: (report.numFailedTests ?? 0) + brokenFiles.length,
    skipped: (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0),
    tests: report.numTotalTests ?? 0,
  };
  if (files.length > 1) {
    console.log(`  ${basename(file)}: ${counts.passed} passed, ${counts.failed} failed, ${counts.skipped} skipped`);
  }
  if (counts.failed > 0 || counts.tests === 0) ok = false;
  for (const k of Object.keys(total)) total[k] += counts[k];
}
console.log(`vitest: ${total.passed} passed, ${total.failed} failed, ${total.skipped} skipped`);
process.exit(ok ? 0 : 1);
