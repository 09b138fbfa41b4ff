import { describe, expect, it } from 'vitest';
import { playwrightFailures, runnerCounts, vitestCounts, vitestFailures } from './summary.mjs';

const ESC = String.fromCharCode(27);

describe('failure lines (the tail CI keeps names what failed)', () => {
  it('names each failed Vitest test with its file, the first line of its error and a property test’s counterexample', () => {
    const report = {
      testResults: [
        {
          name: '/repo/lib/a.test.ts',
          status: 'failed',
          assertionResults: [
            { status: 'passed', fullName: 'a works' },
            { status: 'failed', fullName: 'a › breaks', failureMessages: [`${ESC}[31mAssertionError: expected 1 to be 2${ESC}[39m\n    at x`] },
            {
              status: 'failed',
              fullName: 'a › property',
              failureMessages: ['Error: Property failed after 3 tests\n{ seed: 7, path: "2" }\nCounterexample: [1,2]\nShrunk 0 time(s)'],
            },
          ],
        },
        { name: '/repo/tests/b.test.ts', status: 'failed', message: 'SyntaxError: Unexpected token', assertionResults: [] },
        { name: '/repo/tests/c.test.ts', status: 'passed', assertionResults: [{ status: 'passed', fullName: 'c' }] },
      ],
    };
    expect(vitestFailures(report, '/repo')).toEqual([
      'lib/a.test.ts › a › breaks — AssertionError: expected 1 to be 2',
      'lib/a.test.ts › a › property — Error: Property failed after 3 tests { seed: 7, path: "2" } Counterexample: [1,2]',
      'tests/b.test.ts (did not run) — SyntaxError: Unexpected token',
    ]);
  });

  it('names a Playwright test only when every try failed', () => {
    const report = {
      suites: [
        {
          title: 'x.spec.ts',
          specs: [
            { file: 'x.spec.ts', title: 'flaky', tests: [{ status: 'flaky', results: [{ error: { message: 'first try' } }, {}] }] },
            { file: 'x.spec.ts', title: 'broken', tests: [{ status: 'unexpected', results: [{ error: { message: 'Error: timed out\nmore' } }] }] },
          ],
          suites: [{ title: 'refusals', specs: [{ file: 'x.spec.ts', title: 'a 403', tests: [{ status: 'unexpected', results: [{ error: { message: 'nope' } }] }] }] }],
        },
      ],
    };
    expect(playwrightFailures(report)).toEqual(['x.spec.ts › broken — Error: timed out', 'x.spec.ts › refusals › a 403 — nope']);
  });

  it('counts a runner that exited non-zero with no failed test as 1 failed', () => {
    expect(runnerCounts(null, vitestCounts, 1)).toMatchObject({ failed: 1, missing: true });
  });
});
