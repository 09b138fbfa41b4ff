// The integer-programming solver (HiGHS, npm `highs`, compiled to WebAssembly) on its own thread.
// mip.ts posts one model at a time and blocks on a shared flag with a timeout, so the planner stays
// synchronous and never waits past its deadline, even when HiGHS does: it checks its time limit and
// the stop flag only between steps, and on a loaded machine one step (the root LP) ran for seconds.
// flag[0]: id of the last answer (the caller waits on it); flag[1]: id of a solve the caller gave up on.
// A plain .mjs, like plan-worker.mjs: Node loads it as it is under `next start`, tsx and Vitest.
import { workerData } from 'node:worker_threads';
import loadHighs from 'highs';

const flag = new Int32Array(workerData.flag);
/** @type {import('node:worker_threads').MessagePort} */
const port = workerData.port;
const highsReady = loadHighs();
// flag[2]: 1 once HiGHS is loaded; the caller skips its stages until then rather than wait for it.
const loaded = (state) => {
  Atomics.store(flag, 2, state);
  Atomics.notify(flag, 2);
};
highsReady.then(
  () => loaded(1),
  () => loaded(-1),
);

function reply(id, message) {
  port.postMessage(message);
  Atomics.store(flag, 0, id);
  Atomics.notify(flag, 0);
}

async function solve({ id, model, stopAt, start }) {
  const highs = await highsReady;
  const m = highs.createModel(model);
  try {
    m.options.set({
      output_flag: false,
      time_limit: Math.max(0.001, (stopAt - Date.now()) / 1000),
      mip_rel_gap: 0,
      // The objective is whole cost units (arc-flow.ts), so a gap under one unit is closed; 0.99 leaves
      // room for the caller's rounding of the bound.
      mip_abs_gap: 0.99,
    });
    if (start) m.setSolution({ colValue: Float64Array.from(start) });
    // HiGHS's own time limit is checked between phases only; these hooks stop it inside them too.
    const stop = (event) => {
      if (Date.now() >= stopAt || Atomics.load(flag, 1) === id) event.interrupt();
    };
    const { callbackType } = highs.constants;
    m.run({ [callbackType.mipInterrupt]: stop, [callbackType.simplexInterrupt]: stop, [callbackType.ipmInterrupt]: stop });
    const status = m.getModelStatus();
    const info = (name) => {
      try {
        const v = m.info.get(name);
        return typeof v === 'bigint' ? Number(v) : v;
      } catch {
        return null;
      }
    };
    const primal = info('primal_solution_status') === 2;
    const solution = primal ? Array.from(m.getSolution().colValue) : null;
    reply(id, {
      id,
      status,
      optimal: status === highs.constants.modelStatus.optimal,
      infeasible: status === highs.constants.modelStatus.infeasible,
      objective: primal ? m.getObjectiveValue() : null,
      dualBound: info('mip_dual_bound'),
      solution,
    });
  } finally {
    m.dispose();
  }
}

port.on('message', (request) => {
  solve(request).catch((error) => reply(request.id, { id: request.id, error: String(error) }));
});
