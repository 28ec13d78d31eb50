// Prints the closing line CI reads from vitest's JSON report.
import { readFileSync } from 'node:fs';

const file = process.argv[2] ?? '.ci/out/vitest.json';
let report;
try {
  report = JSON.parse(readFileSync(file, 'utf8'));
} catch (error) {
  console.error(`summarize: cannot read ${file}: ${error.message}`);
  process.exit(1);
}
const skipped = (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
console.log(`vitest: ${report.numPassedTests} passed, ${report.numFailedTests} failed, ${skipped} skipped`);
process.exit(report.numFailedTests > 0 || report.numTotalTests === 0 ? 1 : 0);
