import 'server-only';
import { createHash } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { LRUCache } from 'lru-cache';
import { Piscina } from 'piscina';
import { AppError } from '@/lib/errors';
import type { PlanTask, PlanTaskResult } from './plan-task';

// Cut plans run on worker threads, never on the request thread (issue 12): one planner search
// stalled every other request for 14.5 s.

/** Plans of one channel computed at once in this process; more wait for the client to retry. */
export const PLANS_PER_CHANNEL = 2;
/**
 * After the budget, how long a worker may still run before it is stopped and the request fails.
 * Generous: stopping a thread costs a new one that loads the planner again, and on a loaded
 * machine that load alone took over 10 s (bench/cut-plan-load).
 */
const OVERRUN_GRACE_MS = 60_000;
/** Plans waiting per thread; more are refused at once rather than left to wait many budgets long. */
const QUEUE_PER_THREAD = 4;
// One core stays with the request thread.
const THREADS = Math.max(1, os.availableParallelism() - 1);

type PoolState = {
  pool: Piscina<PlanTask, PlanTaskResult>;
  running: Map<string, number>;
  inFlight: Map<string, Promise<PlanTaskResult>>;
  cache: LRUCache<string, PlanTaskResult>;
};

const holder = globalThis as typeof globalThis & { kerflinePlanPool?: PoolState };

function state(): PoolState {
  holder.kerflinePlanPool ??= {
    pool: new Piscina<PlanTask, PlanTaskResult>({
      // A plain .mjs outside the bundle: Next would not compile a worker entry, and Vitest runs the
      // same file. Every start script runs the app from the repository root.
      filename: pathToFileURL(path.join(process.cwd(), 'lib', 'cut-plans', 'plan-worker.mjs')).href,
      maxThreads: THREADS,
      // Threads stay up once started: each one loads (and compiles) the planner when it starts.
      minThreads: THREADS,
      idleTimeout: Number.POSITIVE_INFINITY,
      maxQueue: THREADS * QUEUE_PER_THREAD,
    }),
    running: new Map(),
    inFlight: new Map(),
    // In-process LRU rather than a PostgreSQL table: a plan is derived data, at most one budget to
    // recompute, and several app processes each warming their own cache cost only that; a table
    // would add a write and a cleanup to every read. The key is the inputs' hash, so nothing goes stale.
    cache: new LRUCache<string, PlanTaskResult>({ max: 200 }),
  };
  return holder.kerflinePlanPool;
}

/** sha256 of the task as JSON: parts, stock, settings, levels and budget are all the inputs there are. */
export function planTaskKey(task: PlanTask): string {
  return createHash('sha256').update(JSON.stringify(task)).digest('hex');
}

const busy = () =>
  new AppError('too_many_requests', 'Cut plans for this channel are already being worked out. Try again in a few seconds.', undefined, {
    retryAfterSeconds: 5,
  });

/**
 * Runs a plan on the worker pool: a cached result by the inputs' hash, the same promise for an
 * identical plan already running, or a new run if the channel has fewer than PLANS_PER_CHANNEL going.
 */
export async function computePlan(channelId: string, task: PlanTask): Promise<PlanTaskResult> {
  const s = state();
  const key = planTaskKey(task);
  const cached = s.cache.get(key);
  if (cached) return cached;
  const pending = s.inFlight.get(key);
  if (pending) return pending;
  const running = s.running.get(channelId) ?? 0;
  if (running >= PLANS_PER_CHANNEL) throw busy();
  s.running.set(channelId, running + 1);
  const run = runOnPool(s, task).then((result) => {
    s.cache.set(key, result);
    return result;
  });
  s.inFlight.set(key, run);
  try {
    return await run;
  } finally {
    s.inFlight.delete(key);
    const left = (s.running.get(channelId) ?? 1) - 1;
    if (left > 0) s.running.set(channelId, left);
    else s.running.delete(channelId);
  }
}

async function runOnPool(s: PoolState, task: PlanTask): Promise<PlanTaskResult> {
  try {
    if (s.pool.queueSize >= s.pool.options.maxQueue) throw busy();
    // The signal counts from now, so it allows for the budgets of the plans queued ahead of this one.
    const waitAhead = Math.ceil((s.pool.queueSize + 1) / THREADS) * task.budgetMs;
    return await s.pool.run(task, { signal: AbortSignal.timeout(waitAhead + task.budgetMs + OVERRUN_GRACE_MS) });
  } catch (err) {
    // Source: piscina 5 (dist/errors.js): a full queue rejects with this message.
    if (err instanceof Error && err.message === 'Task queue is at limit') throw busy();
    if (err instanceof Error && err.name === 'AbortError') {
      throw new AppError('internal', 'Working out this cut plan took too long. Try again with fewer parts.', undefined, { cause: err });
    }
    throw err;
  }
}

/** Starts the threads and loads the planner in them, so the first plan request does not wait for that. */
export async function warmPlanPool(): Promise<void> {
  const settings = { kerfIn: 0, endTrimIn: 0, minOffcutIn: 0, jointIn: 0, lengthUnit: 'in' as const };
  await state().pool.run({ parts: [], stock: [], settings, byLevel: false, budgetMs: 0 });
}

/** For tests: how many plans of a channel are running in this process now. */
export const runningPlans = (channelId: string): number => state().running.get(channelId) ?? 0;
