import { randomUUID } from 'node:crypto';
import nodemailer from 'nodemailer';

// The one reader of the test mail catcher (maildev), shared by the integration and end-to-end tests.
// scripts/test.mjs starts maildev and sets MAILDEV_WEB_URL and SMTP_URL; the defaults are its usual ports.

export type CaughtMail = { subject: string; text: string; html: string; to: { address: string }[] };

const webUrl = () => process.env.MAILDEV_WEB_URL ?? 'http://127.0.0.1:1081';
const smtpUrl = () => process.env.SMTP_URL ?? 'smtp://127.0.0.1:1026';
const POLL_MS = 100;

const isTo = (mail: CaughtMail, address: string) => mail.to.some((t) => t.address.toLowerCase() === address.toLowerCase());

/** Every message the catcher holds now. Source: maildev 3 REST API, `GET /api/email`. */
export async function caughtMail(): Promise<CaughtMail[]> {
  const res = await fetch(`${webUrl()}/api/email`);
  if (!res.ok) throw new Error(`mail catcher answered ${res.status}`);
  return (await res.json()) as CaughtMail[];
}

export const mailTo = async (address: string): Promise<CaughtMail[]> => (await caughtMail()).filter((m) => isTo(m, address));

/**
 * Polls until at least `atLeast` messages to `address` (optionally containing `needle`) have arrived,
 * and returns them. Arrival is the event; the timeout only bounds a test that would otherwise hang.
 */
export async function waitForMail(
  address: string,
  { atLeast = 1, needle, timeoutMs = 15_000 }: { atLeast?: number; needle?: string; timeoutMs?: number } = {},
): Promise<CaughtMail[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const mine = (await mailTo(address)).filter((m) => needle === undefined || m.text.includes(needle));
    if (mine.length >= atLeast) return mine;
    if (Date.now() > deadline) throw new Error(`expected ${atLeast} mail(s) to ${address}${needle ? ` containing “${needle}”` : ''}, found ${mine.length}`);
    await new Promise((r) => setTimeout(r, POLL_MS));
  }
}

/**
 * The mail to `address` once everything sent before this call has landed: it sends a marker message
 * through the same SMTP server and waits for the marker to arrive, so a "no mail" or "exactly one"
 * check cannot pass merely because a slow message had not been stored yet. The marker goes to its
 * own address and never shows up in anyone's list.
 */
export async function mailAfterEverythingSent(address: string): Promise<CaughtMail[]> {
  const marker = `marker-${randomUUID()}@catcher.kerfline.test`;
  const url = new URL(smtpUrl());
  const transport = nodemailer.createTransport({ host: url.hostname, port: Number(url.port || 25), secure: false, ignoreTLS: true });
  try {
    await transport.sendMail({ from: 'marker@catcher.kerfline.test', to: marker, subject: 'marker', text: 'marker' });
  } finally {
    transport.close();
  }
  await waitForMail(marker);
  return mailTo(address);
}

export function invitationTokenFrom(mail: CaughtMail): string {
  const match = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text);
  if (!match?.[1]) throw new Error('no invitation link in mail');
  return match[1];
}
