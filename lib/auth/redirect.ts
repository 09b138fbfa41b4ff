/**
 * Where to send someone after sign-in: only a path on this app, never another site.
 *
 * Browsers strip tab and newline from URLs and read "\" as "/" (Source: WHATWG URL Standard,
 * "basic URL parser", the special-scheme backslash rule and the ASCII tab/newline removal), so
 * "/\evil.example" and "/<TAB>/evil.example" both become "//evil.example", a link to another
 * host. Such input is refused outright, then the rest is parsed with the URL API against the
 * app's own origin and kept only when the origin is still ours.
 */
export const SAFE_FALLBACK_PATH = '/';

// eslint-disable-next-line no-control-regex -- control characters are exactly what is refused
const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;
// The same characters percent-encoded, and an encoded "\" or "/", in case something decodes twice.
const ENCODED_TRICK = /%(?:0[0-9a-f]|1[0-9a-f]|7f|5c|2f)/i;

export function safeRedirectPath(raw: unknown, origin: string): string {
  if (typeof raw !== 'string' || raw.length === 0 || raw.length > 2000) return SAFE_FALLBACK_PATH;
  if (!raw.startsWith('/') || raw.startsWith('//')) return SAFE_FALLBACK_PATH;
  if (raw.includes('\\') || CONTROL.test(raw) || ENCODED_TRICK.test(raw)) return SAFE_FALLBACK_PATH;
  let base: URL;
  let url: URL;
  try {
    base = new URL(origin);
    url = new URL(raw, base);
  } catch {
    return SAFE_FALLBACK_PATH;
  }
  if (url.origin !== base.origin) return SAFE_FALLBACK_PATH;
  return `${url.pathname}${url.search}${url.hash}`;
}

/** For next-auth's redirect callback: an absolute URL on `baseUrl`, or `baseUrl` itself. */
export function safeRedirectUrl(url: string, baseUrl: string): string {
  const home = `${baseUrl.replace(/\/+$/, '')}${SAFE_FALLBACK_PATH}`;
  let candidate = url;
  try {
    const parsed = new URL(url);
    // An absolute URL is fine only when it is ours; it is then checked again as a path.
    if (parsed.origin !== new URL(baseUrl).origin) return home;
    candidate = `${parsed.pathname}${parsed.search}${parsed.hash}`;
  } catch {
    // Not absolute: a path, checked below.
  }
  const path = safeRedirectPath(candidate, baseUrl);
  return `${baseUrl.replace(/\/+$/, '')}${path}`;
}
