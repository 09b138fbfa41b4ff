// Next.js calls register() once per server process; background work starts here, never in a request.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  // Throttling keys on the client address; route handlers get no socket, so it is tagged here.
  const { tagRequestsWithPeer } = await import('./lib/http/tag-peer');
  tagRequestsWithPeer();
  if (process.env.KERFLINE_MAIL_WORKER !== 'off') {
    const { startShotMailWorker } = await import('./lib/shots/mail-worker');
    startShotMailWorker();
  }
  if (process.env.KERFLINE_CLIP_WORKER !== 'off') {
    const { startClipWorker } = await import('./storage/worker');
    startClipWorker();
  }
}
