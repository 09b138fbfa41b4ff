// The cut planner's worker thread (Piscina), kept out of Next's bundle on purpose: Node loads this
// plain file as it is, both under `next start` and under Vitest, and tsx (a runtime dependency)
// compiles the TypeScript planner it imports, resolving the `@/` paths from tsconfig.json.
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { register } from 'tsx/cjs/api';

// The `@/` paths come from the repository's tsconfig.json, wherever the process was started.
process.env.TSX_TSCONFIG_PATH ??= fileURLToPath(new URL('../../tsconfig.json', import.meta.url));
// The project's .ts files are CommonJS to Node (package.json has no "type"), so they load through
// tsx's require hook.
register();
const require = createRequire(import.meta.url);
const { runPlanTask } = require('./plan-task.ts');
// HiGHS loads on a thread of its own; plans skip their integer programs until it has (lib/cutlist/mip.ts),
// so it starts with this worker rather than with the first plan.
require('../cutlist/mip.ts').warmUpMipSolver();

export default runPlanTask;
