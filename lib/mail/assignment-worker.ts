import 'server-only';
import { config } from '@/lib/config';
import { pollEvery } from '@/lib/jobs/poll';
import { sendShotMail } from './assignment-queries';

const state = globalThis as unknown as { kerflineShotMailTimer?: NodeJS.Timeout };

/** Sends due assignment bursts every few seconds; bursts live in PostgreSQL, so a restart loses none. */
export function startShotMailWorker(intervalMs = config().SHOT_MAIL_POLL_MS): void {
  state.kerflineShotMailTimer ??= pollEvery(intervalMs, 'assignment e-mail worker', () => sendShotMail());
}
