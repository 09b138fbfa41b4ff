// The app's public address. An operator who serves Kerfline behind https sets NEXTAUTH_URL (and
// optionally APP_URL for links in e-mail); both are kept as given, so next-auth marks its cookies
// Secure and the build adds HSTS. Without them the app is local: http on 127.0.0.1.

/** { localUrl, nextAuthUrl, appUrl, secure } for the given environment and port. */
export function publicUrls(env, port) {
  const localUrl = `http://127.0.0.1:${port}`;
  const clean = (v) => (typeof v === 'string' && v.trim() ? v.trim().replace(/\/+$/, '') : undefined);
  const nextAuthUrl = clean(env.NEXTAUTH_URL) ?? clean(env.APP_URL) ?? localUrl;
  const appUrl = clean(env.APP_URL) ?? nextAuthUrl;
  return { localUrl, nextAuthUrl, appUrl, secure: isSecureUrl(nextAuthUrl) };
}

export const isSecureUrl = (url) => typeof url === 'string' && url.startsWith('https://');
