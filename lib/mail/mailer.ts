import 'server-only';
import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '@/lib/config';

export type Mail = { to: string; subject: string; text: string; html: string };

const globalForMail = globalThis as unknown as { kerflineMailer?: Transporter };

function transporter(): Transporter {
  if (globalForMail.kerflineMailer) return globalForMail.kerflineMailer;
  const url = new URL(config().SMTP_URL);
  const local = url.hostname === '127.0.0.1' || url.hostname === 'localhost';
  globalForMail.kerflineMailer = nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port || 25),
    secure: url.protocol === 'smtps:',
    // The local mail catcher speaks plain SMTP only.
    ignoreTLS: local,
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
  });
  return globalForMail.kerflineMailer;
}

export async function sendMail(mail: Mail): Promise<void> {
  await transporter().sendMail({ from: config().MAIL_FROM, ...mail });
}
