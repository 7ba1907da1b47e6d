// Prints one closing line "N passed, N failed" for Vitest and Playwright together, from their JSON reports.
// A file that fails to load, a failing beforeAll and a runner's own top-level error count as failures, so
// "0 failed" means nothing went wrong. Generated rows (test.each tables, such as the permission grids) are
// told apart from distinct tests by their source location on the line before. LINT_FAILED (set by test.sh) names
// the lint checks that failed (eslint, knip); each counts as one failure.
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
const problems = [];

const vitest = read(process.argv[2]);
let distinct = 0;
let generated = 0;
if (vitest) {
  passed += vitest.numPassedTests ?? 0;
  failed += vitest.numFailedTests ?? 0;
  skipped += (vitest.numPendingTests ?? 0) + (vitest.numTodoTests ?? 0);
  for (const file of vitest.testResults ?? []) {
    const results = file.assertionResults ?? [];
    // A file that failed without any failed test in it: it did not load, or a hook failed.
    if (file.status === 'failed' && !results.some((r) => r.status === 'failed')) {
      failed += 1;
      problems.push(`Vitest: ${file.name}: ${(file.message || 'failed outside its tests').split('\n')[0]}`);
    }
    const places = new Set();
    for (const r of results) {
      const at = r.location ? `${r.location.line}:${r.location.column}` : r.fullName;
      if (places.has(at)) generated += 1;
      else {
        places.add(at);
        distinct += 1;
      }
    }
  }
  if (vitest.success === false && failed === 0) {
    failed += 1;
    problems.push('Vitest reported failure without a failed test.');
  }
} else {
  failed += 1;
  problems.push('Vitest wrote no report.');
}

if (process.argv[3]) {
  const pw = read(process.argv[3]);
  if (pw?.stats) {
    passed += (pw.stats.expected ?? 0) + (pw.stats.flaky ?? 0);
    failed += pw.stats.unexpected ?? 0;
    skipped += pw.stats.skipped ?? 0;
    distinct += (pw.stats.expected ?? 0) + (pw.stats.flaky ?? 0) + (pw.stats.unexpected ?? 0);
    for (const e of pw.errors ?? []) {
      failed += 1;
      problems.push(`Playwright: ${(e.message ?? String(e)).split('\n')[0]}`);
    }
  } else {
    failed += 1;
    problems.push('Playwright wrote no report.');
  }
}

for (const check of (process.env.LINT_FAILED ?? '').split(/\s+/).filter(Boolean)) {
  failed += 1;
  problems.push(`Lint: ${check} failed (its report is above).`);
}

for (const p of problems) console.log(p);
if (vitest) console.log(`(${distinct} distinct tests and ${generated} generated table rows)`);
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
