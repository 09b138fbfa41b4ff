/**
 * Stage timings of the linear pipeline, for the benchmark (bench/cutlist/run.ts --trace) only: a
 * process-wide sink that is null in the product, where a lap costs one comparison. Pure: the planner
 * reports, the caller decides what to do with it.
 */
export interface StageLap {
  stage: string;
  ms: number;
  /** The plan was proven least-cost when this stage ended. */
  proven: boolean;
}

let sink: ((lap: StageLap) => void) | null = null;

/** Sends every stage's lap to `fn` (null stops it). */
export function setStageTrace(fn: ((lap: StageLap) => void) | null): void {
  sink = fn;
}

/** A clock for one planner call: `lap(stage, proven)` reports the time since the previous lap. */
export function startStageClock(): (stage: string, proven: boolean) => void {
  if (!sink) return () => undefined;
  let last = performance.now();
  return (stage, proven) => {
    const now = performance.now();
    sink?.({ stage, ms: now - last, proven });
    last = now;
  };
}
