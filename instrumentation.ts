// Next.js calls register() once per server process; background work starts here, never in a request.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs' || process.env.KERFLINE_MAIL_WORKER === 'off') return;
  const { startShotMailWorker } = await import('./lib/shots/mail-worker');
  startShotMailWorker();
}
