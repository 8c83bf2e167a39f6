// Prints the suite's totals as one plain line ("tests: N passed, N failed, N skipped") from
// vitest's JSON report, so a reader of CI output needs no knowledge of vitest's own format.
import { readFileSync } from 'node:fs';

const report = JSON.parse(readFileSync(new URL('../artifacts/vitest-results.json', import.meta.url), 'utf8'));
const skipped = (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
console.log(`tests: ${report.numPassedTests} passed, ${report.numFailedTests} failed, ${skipped} skipped`);
if (report.numTotalTests === 0) {
  console.error('no test ran');
  process.exit(1);
}
