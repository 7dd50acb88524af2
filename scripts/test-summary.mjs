// Prints one closing line "tests: N passed, N failed, N skipped" over the vitest and Playwright JSON reports.
import { existsSync, readFileSync } from "node:fs";

let passed = 0,
  failed = 0,
  skipped = 0,
  missing = 0;
for (const file of process.argv.slice(2)) {
  if (!existsSync(file)) {
    missing++;
    console.error(`[summary] no report at ${file}`);
    continue;
  }
  const r = JSON.parse(readFileSync(file, "utf8"));
  if ("numPassedTests" in r) {
    passed += r.numPassedTests;
    failed += r.numFailedTests;
    skipped += r.numPendingTests + (r.numTodoTests ?? 0);
  } else if (r.stats) {
    passed += r.stats.expected;
    failed += r.stats.unexpected;
    skipped += r.stats.skipped;
    passed += r.stats.flaky;
  }
}
console.log(`tests: ${passed} passed, ${failed + missing} failed, ${skipped} skipped`);
process.exit(failed + missing > 0 || passed === 0 ? 1 : 0);
