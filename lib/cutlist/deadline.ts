/**
 * The planner's time limit as a hard limit: every loop that can run long asks `expired` (or
 * `expiredEvery` in the hottest ones), so no call overruns its limit by more than one step of a loop.
 * Once past, a deadline stays past.
 */
export interface Deadline {
  at: number; // Date.now() value from which work stops
  ticks: number;
  done: boolean;
}

export function deadlineIn(ms: number, from = Date.now()): Deadline {
  return { at: from + ms, ticks: 0, done: false };
}

/**
 * `>=`, not `>`: a share of 0 ms (a stage with no time left) is over at once. With `>` every such stage
 * still ran to the next tick of the millisecond clock, and a plan of many stock groups at the end of
 * its budget paid that once per stage per group (lib/cut-plans/plan-task.test.ts).
 */
export function expired(d: Deadline): boolean {
  if (!d.done && Date.now() >= d.at) d.done = true;
  return d.done;
}

/** For the hottest loops: reads the clock once in `every` calls (a power of two). */
export function expiredEvery(d: Deadline, every = 256): boolean {
  d.ticks++;
  if (d.done) return true;
  return (d.ticks & (every - 1)) === 0 && expired(d);
}

/** A deadline at `share` of the time left, never later than `d`. */
export function shareOf(d: Deadline, share: number): Deadline {
  const now = Date.now();
  return deadlineIn(Math.max(0, share * (d.at - now)), now);
}
