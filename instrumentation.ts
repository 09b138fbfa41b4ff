// Next.js calls register() once per server process; background work starts here, never in a request.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  if (process.env.KERFLINE_MAIL_WORKER !== 'off') {
    const { startShotMailWorker } = await import('./lib/shots/mail-worker');
    startShotMailWorker();
  }
  if (process.env.KERFLINE_REMINDER_WORKER !== 'off') {
    const { startReminderWorker } = await import('./lib/reminders/worker');
    startReminderWorker();
  }
  if (process.env.KERFLINE_CLIP_WORKER !== 'off') {
    const { startClipWorker } = await import('./storage/worker');
    startClipWorker();
  }
}
