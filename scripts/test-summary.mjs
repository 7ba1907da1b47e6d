// Prints "N passed, N failed" for Vitest and Playwright together, from their JSON reports.
import { readFileSync } from 'node:fs';

const read = (file) => {
  try {
    return JSON.parse(readFileSync(file, 'utf8'));
  } catch {
    return null;
  }
};
let passed = 0;
let failed = 0;
let skipped = 0;
const vitest = read(process.argv[2]);
if (vitest) {
  passed += vitest.numPassedTests ?? 0;
  failed += (vitest.numFailedTests ?? 0) + (vitest.numRuntimeErrorTestSuites ?? 0);
  skipped += (vitest.numPendingTests ?? 0) + (vitest.numTodoTests ?? 0);
} else failed += 1;
const pw = process.argv[3] ? read(process.argv[3]) : null;
if (!process.argv[3]) {
  // Vitest alone (SKIP_E2E=1).
} else if (pw?.stats) {
  passed += (pw.stats.expected ?? 0) + (pw.stats.flaky ?? 0);
  failed += pw.stats.unexpected ?? 0;
  skipped += pw.stats.skipped ?? 0;
} else failed += 1;
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
