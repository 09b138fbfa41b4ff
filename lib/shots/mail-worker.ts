import 'server-only';
import { sendShotMail } from './mail-queries';

const state = globalThis as unknown as { kerflineShotMailTimer?: NodeJS.Timeout };

/** Sends due assignment bursts every few seconds; bursts live in PostgreSQL, so a restart loses none. */
export function startShotMailWorker(intervalMs = Number(process.env.SHOT_MAIL_POLL_MS ?? 10_000)): void {
  if (state.kerflineShotMailTimer) return;
  let running = false;
  state.kerflineShotMailTimer = setInterval(() => {
    if (running) return;
    running = true;
    sendShotMail()
      .catch((err: unknown) => console.error('assignment e-mail worker', err))
      .finally(() => {
        running = false;
      });
  }, intervalMs);
  state.kerflineShotMailTimer.unref();
}
