// The public address of the app, for links in e-mail.
export function appUrl(): string {
  return (process.env.APP_URL ?? process.env.NEXTAUTH_URL ?? 'http://127.0.0.1:3000').replace(/\/+$/, '');
}
