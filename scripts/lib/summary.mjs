// The closing `N passed, N failed[, N skipped]` line, summed from the runners' JSON reports.
import fs from 'node:fs';

export const emptyCounts = () => ({ passed: 0, failed: 0, skipped: 0 });

export function readJsonReport(file) {
  try {
    return JSON.parse(fs.readFileSync(file, 'utf8'));
  } catch {
    return null;
  }
}

const num = (value) => (Number.isFinite(value) ? value : 0);

/** A test file that failed without a failed test in it did not load (syntax, import, hook error). */
const brokenFiles = (report) =>
  (report.testResults ?? []).filter(
    (file) => file.status === 'failed' && !(file.assertionResults ?? []).some((a) => a.status === 'failed'),
  ).length;

/**
 * Vitest's json reporter: numPassedTests / numFailedTests / numPendingTests + numTodoTests, plus
 * 1 failed for each test file that could not run at all.
 */
export function vitestCounts(report) {
  return {
    passed: num(report.numPassedTests),
    failed: num(report.numFailedTests) + brokenFiles(report),
    skipped: num(report.numPendingTests) + num(report.numTodoTests),
  };
}

/** Playwright's json reporter: a flaky test passed on retry, so it counts as passed. */
export function playwrightCounts(report) {
  const stats = report.stats ?? {};
  return {
    passed: num(stats.expected) + num(stats.flaky),
    failed: num(stats.unexpected),
    skipped: num(stats.skipped),
  };
}

/**
 * Counts for one runner from its report file. A missing or unreadable report (the runner crashed)
 * is 1 failed; so is a non-zero exit whose report shows no failed test (a suite that did not load,
 * a web server that did not start, an unhandled error).
 */
export function runnerCounts(file, countsOf, exitCode) {
  const report = readJsonReport(file);
  if (!report) return { ...emptyCounts(), failed: 1, missing: true };
  const counts = countsOf(report);
  if (exitCode !== 0 && counts.failed === 0) counts.failed = 1;
  return counts;
}

export function addCounts(total, counts) {
  total.passed += counts.passed;
  total.failed += counts.failed;
  total.skipped += counts.skipped;
  return total;
}

export function summaryLine({ passed, failed, skipped }) {
  const line = `${passed} passed, ${failed} failed`;
  return skipped > 0 ? `${line}, ${skipped} skipped` : line;
}
