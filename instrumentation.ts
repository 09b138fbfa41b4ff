// Next.js calls register() once per server process; background work starts here, never in a request.
export async function register(): Promise<void> {
  // Next's own variable, read literally so the edge bundle drops everything below.
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  // Validates the whole environment now, so a bad value stops the server at start with its name.
  const { config } = await import('./lib/config');
  const env = config();
  // Throttling keys on the client address; route handlers get no socket, so it is tagged here.
  const { tagRequestsWithPeer } = await import('./lib/http/tag-peer');
  tagRequestsWithPeer();
  if (env.KERFLINE_MAIL_WORKER) {
    const { startShotMailWorker } = await import('./lib/mail/assignment-worker');
    startShotMailWorker();
  }
  if (env.KERFLINE_REMINDER_WORKER) {
    const { startReminderWorker } = await import('./lib/reminders/worker');
    startReminderWorker();
  }
  {
    const { warmPlanPool } = await import('./lib/cut-plans/plan-pool');
    warmPlanPool().catch((err: unknown) => console.error('cut plan workers', err));
  }
  if (env.KERFLINE_CLIP_WORKER) {
    const { startClipWorker } = await import('./storage/worker');
    startClipWorker();
  }
}
