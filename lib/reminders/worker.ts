import 'server-only';
import { now } from '@/lib/clock/queries';
import { config } from '@/lib/config';
import { pollEvery } from '@/lib/jobs/poll';
import { sendDueReminders } from './queries';

const state = globalThis as unknown as { kerflineReminderTimer?: NodeJS.Timeout };

/** Checks for due reminders every minute; what was sent lives in PostgreSQL, so restarts repeat nothing. */
export function startReminderWorker(intervalMs = config().REMINDER_POLL_MS): void {
  state.kerflineReminderTimer ??= pollEvery(intervalMs, 'reminder e-mail worker', async () => sendDueReminders(await now()));
}
