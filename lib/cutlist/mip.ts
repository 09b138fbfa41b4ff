/**
 * A general integer-programming solver for the planner's exact stages: HiGHS (npm `highs`, MIT,
 * WebAssembly, no network) on a thread of its own (mip-worker.mjs). The call is synchronous like the
 * rest of the planner: it posts the model and blocks on a shared flag until the answer or the
 * deadline, whichever comes first, so a solve never carries a call past its limit. HiGHS is asked to
 * stop a little before the deadline so its best solution comes back; if it has not answered by then,
 * the caller goes on and the thread is told to stop, and a later solve that finds it still busy ends
 * it and starts a fresh one (a fresh WebAssembly heap, as after every SOLVES_PER_THREAD solves).
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
/** Solves in one thread before a fresh one: a WebAssembly heap grows and never shrinks. */
const SOLVES_PER_THREAD = 40;
/** Ending HiGHS needs a worker thread file; every start script runs from the repository root. */
const WORKER_FILE = path.join(process.cwd(), 'lib', 'cutlist', 'mip-worker.mjs');

interface Thread {
  worker: Worker;
  port: MessagePort;
  flag: Int32Array;
  solves: number;
  nextId: number;
}

let thread: Thread | null = null;
let available: boolean | null = null;

/** Whether the solver can run here (the worker file is found); false in a browser bundle or elsewhere. */
export function mipAvailable(): boolean {
  available ??= typeof Atomics.wait === 'function' && existsSync(WORKER_FILE);
  return available;
}

function startThread(): Thread {
  // [0]: id of the last answer, [1]: id of a solve to stop.
  const flag = new SharedArrayBuffer(8);
  const { port1, port2 } = new MessageChannel();
  // No tsx or test hooks in this thread: it loads only the plain .mjs and `highs`.
  const worker = new Worker(WORKER_FILE, { workerData: { flag, port: port2 }, transferList: [port2], execArgv: [] });
  worker.unref();
  port1.unref();
  const t: Thread = { worker, port: port1, flag: new Int32Array(flag), solves: 0, nextId: 0 };
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

/** Ends the solver thread (tests and scripts that want to exit at once; a later solve starts a new one). */
export function stopMipSolver(): void {
  if (thread) stopThread(thread);
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
  // HiGHS is asked to stop early enough to hand back the best solution it has when time runs out.
  const stopAt = Date.now() + STOP_SHARE * budget;
  if (thread && (thread.solves >= SOLVES_PER_THREAD || Atomics.load(thread.flag, 0) !== thread.nextId)) stopThread(thread);
  const t = (thread ??= startThread());
  t.solves++;
  const id = ++t.nextId;
  t.port.postMessage({ id, model, stopAt, start });
  for (;;) {
    const seen = Atomics.load(t.flag, 0);
    if (seen === id) break;
    const left = waitUntil - Date.now();
    if (left <= 0 || Atomics.wait(t.flag, 0, seen, left) === 'timed-out') {
      // Past the deadline: the caller goes on at once and HiGHS stops at its next check of the stop flag
      // or its time limit, in its own thread; a solve that finds it still busy ends the thread instead.
      if (Atomics.load(t.flag, 0) !== id) {
        Atomics.store(t.flag, 1, id);
        return null;
      }
    }
  }
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
