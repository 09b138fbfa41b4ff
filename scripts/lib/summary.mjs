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
 * Counts for one runner from its parsed report (null: missing or unreadable, the runner crashed),
 * which is 1 failed; so is a non-zero exit whose report shows no failed test (a suite that did not
 * load, a web server that did not start, an unhandled error).
 */
export function runnerCounts(report, countsOf, exitCode) {
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

// CI keeps only the tail of the output, so each failure is named again there on one short line.
const ANSI = new RegExp(`${String.fromCharCode(27)}\\[[0-9;]*m`, 'g');
const clip = (line, max) => (line.length > max ? `${line.slice(0, max - 1)}…` : line);
/** The error's first line, and a property test's counterexample, which is what reproduces it. */
const firstLine = (messages) => {
  const lines = String((messages ?? [])[0] ?? '').replace(ANSI, '').split('\n');
  const first = clip(lines.find((l) => l.trim()) ?? '', 240);
  const seed = lines.find((l) => l.startsWith('{ seed:'));
  const counter = lines.find((l) => l.startsWith('Counterexample:'));
  return [first, seed, counter && clip(counter, 600)].filter(Boolean).join(' ');
};

/** Vitest's json reporter: "file › full name — first line of the error" for every failed test and unloaded file. */
export function vitestFailures(report, root) {
  const out = [];
  for (const file of report.testResults ?? []) {
    const name = root ? file.name.replace(`${root}/`, '') : file.name;
    const failed = (file.assertionResults ?? []).filter((a) => a.status === 'failed');
    for (const a of failed) out.push(`${name} › ${a.fullName} — ${firstLine(a.failureMessages)}`);
    if (file.status === 'failed' && failed.length === 0) out.push(`${name} (did not run) — ${firstLine([file.message])}`);
  }
  return out;
}

/** Playwright's json reporter: "file › title — first line of the error" for every test that failed every try. */
export function playwrightFailures(report) {
  const out = [];
  const walk = (suite, parents) => {
    // The outermost suites are the spec files; their title is the file name, already printed.
    const titles = suite.title && !suite.title.endsWith('.ts') ? [...parents, suite.title] : parents;
    for (const spec of suite.specs ?? []) {
      for (const test of spec.tests ?? []) {
        if (test.status !== 'unexpected') continue;
        const last = (test.results ?? []).at(-1);
        out.push(`${spec.file} › ${[...titles, spec.title].join(' › ')} — ${firstLine([last?.error?.message])}`);
      }
    }
    for (const child of suite.suites ?? []) walk(child, titles);
  };
  for (const suite of report.suites ?? []) walk(suite, []);
  return out;
}

export function summaryLine({ passed, failed, skipped }) {
  const line = `${passed} passed, ${failed} failed`;
  return skipped > 0 ? `${line}, ${skipped} skipped` : line;
}
