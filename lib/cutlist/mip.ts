/**
 * A general integer-programming solver for the planner's exact stages: HiGHS (npm `highs`, MIT,
 * WebAssembly, no network) on a thread of its own (mip-worker.mjs). The call is synchronous like the
 * rest of the planner: it posts the model and blocks on a shared flag until the answer or the
 * deadline, whichever comes first, so a solve never carries a call past its limit. HiGHS is asked to
 * stop a little before the deadline so its best solution comes back; if it has not answered by then,
 * the caller goes on and the thread is told to stop. Until the thread has loaded HiGHS, solves are
 * skipped at once (null) rather than waited for; a solve told to stop is waited for up to a quarter of
 * the next solve's time (it stops at HiGHS's next check), then that solve is skipped too; a fresh thread
 * (a fresh WebAssembly heap) replaces one after SOLVES_PER_THREAD solves, or one stuck past STUCK_MS.
 *
 * Source: Q. Huangfu and J. A. J. Hall, "Parallelizing the dual revised simplex method", Math. Prog.
 * Comp. 10 (2018), the solver of https://highs.dev; the package: https://github.com/lovasoa/highs-js.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import { MessageChannel, receiveMessageOnPort, Worker, type MessagePort } from 'node:worker_threads';
import type { Deadline } from './deadline';

/** Sparse model, columns in CSC form; all columns integer unless `integrality[j]` is 0. */
export interface MipModel {
  numCols: number;
  numRows: number;
  colCost: Float64Array;
  colLower: Float64Array;
  colUpper: Float64Array;
  rowLower: Float64Array;
  rowUpper: Float64Array;
  matrix: { format: 'csc'; numRows: number; numCols: number; starts: Int32Array; indices: Int32Array; values: Float64Array };
  integrality: Int32Array;
}

/**
 * An all-integer program with every column bounded below by 0, its matrix given by columns (CSC):
 * column j's entries are `indices`/`values` from `starts[j]` to `starts[j + 1]`. The sizes follow from the arrays.
 */
export function integerModel(m: {
  colCost: Float64Array;
  colUpper: Float64Array;
  rowLower: Float64Array;
  rowUpper: Float64Array;
  starts: Int32Array;
  indices: readonly number[];
  values: readonly number[];
}): MipModel {
  const numCols = m.colCost.length;
  const numRows = m.rowLower.length;
  return {
    numCols,
    numRows,
    colCost: m.colCost,
    colLower: new Float64Array(numCols),
    colUpper: m.colUpper,
    rowLower: m.rowLower,
    rowUpper: m.rowUpper,
    matrix: { format: 'csc', numRows, numCols, starts: m.starts, indices: Int32Array.from(m.indices), values: Float64Array.from(m.values) },
    integrality: new Int32Array(numCols).fill(1),
  };
}

export interface MipResult {
  /** HiGHS closed the gap: `objective` is the least cost (whole units, see `mip-worker.mjs`). */
  optimal: boolean;
  /** Proven that no solution exists. */
  infeasible: boolean;
  objective: number | null;
  /** HiGHS's lower bound on the objective when it stopped. */
  dualBound: number | null;
  solution: Float64Array | null;
}

/** Time kept back for the thread hand-off and for decoding the answer. */
const HAND_OFF_MS = 10;
/** Share of the time HiGHS gets before it is asked to stop, so its answer comes back before the deadline. */
const STOP_SHARE = 0.8;
/** An abandoned solve still running after this long is ended with its thread (HiGHS's own limit failed). */
const STUCK_MS = 10_000;
/** Share of a solve's time it may wait for a solve it told to stop to finish (`afterAbandoned`). */
const ABANDONED_WAIT_SHARE = 0.25;
/** Solves in one thread before a fresh one: a WebAssembly heap grows and never shrinks. */
const SOLVES_PER_THREAD = 100;
/** Ending HiGHS needs a worker thread file; every start script runs from the repository root. */
const WORKER_FILE = path.join(process.cwd(), 'lib', 'cutlist', 'mip-worker.mjs');

interface Thread {
  worker: Worker;
  port: MessagePort;
  flag: Int32Array;
  solves: number;
  nextId: number;
  busySince: number;
}

let thread: Thread | null = null;
let available: boolean | null = null;

/** Whether the solver can run here (the worker file is found); false in a browser bundle or elsewhere. */
export function mipAvailable(): boolean {
  available ??= typeof Atomics.wait === 'function' && existsSync(WORKER_FILE);
  return available;
}

function startThread(): Thread {
  // [0]: id of the last answer, [1]: id of a solve to stop, [2]: 1 once HiGHS is loaded (-1 if it failed).
  const flag = new SharedArrayBuffer(12);
  const { port1, port2 } = new MessageChannel();
  // No tsx or test hooks in this thread: it loads only the plain .mjs and `highs`.
  const worker = new Worker(WORKER_FILE, { workerData: { flag, port: port2 }, transferList: [port2], execArgv: [] });
  worker.unref();
  port1.unref();
  const t: Thread = { worker, port: port1, flag: new Int32Array(flag), solves: 0, nextId: 0, busySince: 0 };
  worker.on('error', () => stopThread(t));
  return t;
}

function stopThread(t: Thread): void {
  if (thread === t) thread = null;
  t.port.close();
  void t.worker.terminate();
}

/**
 * Starts the solver thread if it is not running, without waiting: loading and compiling HiGHS takes
 * 100–200 ms, which then overlaps the planner's own first stages instead of eating a solve's time.
 */
export function warmUpMipSolver(): void {
  if (mipAvailable() && !thread) thread = startThread();
}

// In Node since 16; in TypeScript's lib only from es2024, and tsconfig.json targets ES2022.
type WaitAsync = (a: Int32Array, index: number, value: number, timeoutMs: number) => { value: Promise<string> | string };
const waitAsync = (Atomics as unknown as { waitAsync: WaitAsync }).waitAsync;

/**
 * Resolves once the solver thread has loaded HiGHS and is idle (true), or false if it cannot run here
 * or `timeoutMs` passes. For benchmarks and tests that measure the integer programs themselves; the
 * planner never waits for it.
 */
export async function waitForMipSolver(timeoutMs = 30_000): Promise<boolean> {
  warmUpMipSolver();
  // The thread is unref'd and a pending Atomics.waitAsync does not keep Node running: this timer does.
  const keepAlive = setTimeout(() => {}, timeoutMs);
  try {
    return await waitIdle(Date.now() + timeoutMs);
  } finally {
    clearTimeout(keepAlive);
  }
}

async function waitIdle(end: number): Promise<boolean> {
  for (;;) {
    const t = thread;
    const left = end - Date.now();
    if (!t || left <= 0) return false;
    const loaded = Atomics.load(t.flag, 2);
    if (loaded < 0) return false;
    if (loaded === 0) {
      await waitAsync(t.flag, 2, 0, left).value;
      continue;
    }
    const seen = Atomics.load(t.flag, 0);
    if (seen === t.nextId) return true;
    await waitAsync(t.flag, 0, seen, left).value;
  }
}

/** Ends the solver thread (tests and scripts that want to exit at once; a later solve starts a new one). */
export function stopMipSolver(): void {
  if (thread) stopThread(thread);
}

/**
 * The solver thread if it can take a solve now; otherwise null, and the caller skips its integer
 * programs rather than spend its own time waiting: while HiGHS loads (a fresh thread), or while an
 * abandoned solve still runs (it stops at HiGHS's next check). A thread stuck far longer than any time
 * limit is ended, and the next one starts loading for later calls.
 */
function readyThread(): Thread | null {
  const t = thread;
  if (!t) {
    warmUpMipSolver();
    return null;
  }
  const busy = Atomics.load(t.flag, 0) !== t.nextId;
  if ((busy && Date.now() - t.busySince > STUCK_MS) || Atomics.load(t.flag, 2) < 0) {
    stopThread(t);
    warmUpMipSolver();
    return null;
  }
  return busy || Atomics.load(t.flag, 2) !== 1 ? null : t;
}

/**
 * The solver thread once the solve it was told to stop (an earlier stage of the same call ran out of
 * time) has stopped, waiting until `until` at the latest; null if it is busy otherwise or still running
 * then. HiGHS stops at its next interrupt check (measured 18–190 ms after being told, on a loaded
 * two-core machine), but the next stage came at once and found it busy: the exact arc-flow stage was
 * skipped that way after the integer program over the patterns ran out of its share
 * (bench/cutlist/run.ts --trace: arc-flow skipped 15 and 17 times in 100 lists, 13 and 10 with the wait).
 */
function afterAbandoned(until: number): Thread | null {
  const t = thread;
  if (!t || Atomics.load(t.flag, 1) !== t.nextId) return null;
  for (;;) {
    const seen = Atomics.load(t.flag, 0);
    if (seen === t.nextId) return readyThread();
    const left = until - Date.now();
    if (left <= 0 || Atomics.wait(t.flag, 0, seen, left) === 'timed-out') return null;
  }
}

/**
 * Solves `model` to proven optimality or until `deadline`; null when there was no time, the solver is
 * not available here, or it failed. `start` is a feasible solution to begin from (the heuristic plan).
 */
export function solveMip(model: MipModel, deadline: Deadline, start?: Float64Array): MipResult | null {
  if (!mipAvailable()) return null;
  const waitUntil = deadline.at - HAND_OFF_MS;
  const budget = waitUntil - Date.now();
  if (budget < 5) return null;
  const t = readyThread() ?? afterAbandoned(Date.now() + ABANDONED_WAIT_SHARE * budget);
  if (!t) return null;
  // HiGHS is asked to stop early enough to hand back the best solution it has when time runs out.
  const stopAt = Date.now() + STOP_SHARE * (waitUntil - Date.now());
  t.solves++;
  t.busySince = Date.now();
  const id = ++t.nextId;
  t.port.postMessage({ id, model, stopAt, start });
  for (;;) {
    const seen = Atomics.load(t.flag, 0);
    if (seen === id) break;
    const left = waitUntil - Date.now();
    if (left <= 0 || Atomics.wait(t.flag, 0, seen, left) === 'timed-out') {
      // Past the deadline: the caller goes on at once and HiGHS stops at its next check of the stop flag
      // or its time limit, in its own thread; solves meanwhile are skipped (readyThread).
      if (Atomics.load(t.flag, 0) !== id) {
        Atomics.store(t.flag, 1, id);
        return null;
      }
    }
  }
  const message = receiveAnswer(t, id);
  if (t.solves >= SOLVES_PER_THREAD) {
    // Its heap only grows: the next thread loads while the caller goes on.
    stopThread(t);
    warmUpMipSolver();
  }
  return message;
}

function receiveAnswer(t: Thread, id: number): MipResult | null {
  for (let m = receiveMessageOnPort(t.port); m; m = receiveMessageOnPort(t.port)) {
    const answer = m.message as Partial<MipResult> & { id: number; error?: string; solution?: number[] | null };
    if (answer.id !== id) continue;
    if (answer.error !== undefined) return null;
    return {
      optimal: answer.optimal === true,
      infeasible: answer.infeasible === true,
      objective: answer.objective ?? null,
      dualBound: answer.dualBound ?? null,
      solution: answer.solution ? Float64Array.from(answer.solution) : null,
    };
  }
  return null;
}
