/**
 * Runs `task` every `ms`, never two at once (a slow run skips the next tick), logging failures
 * rather than letting them end the process. The timer does not keep the process alive.
 */
export function pollEvery(ms: number, label: string, task: () => Promise<unknown>): NodeJS.Timeout {
  let busy = false;
  const timer = setInterval(() => {
    if (busy) return;
    busy = true;
    task()
      .catch((err: unknown) => console.error(label, err))
      .finally(() => {
        busy = false;
      });
  }, ms);
  timer.unref();
  return timer;
}
