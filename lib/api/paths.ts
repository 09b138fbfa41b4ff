// Builds app and API paths from their parts, percent-encoding each one, so an id or slug can never
// add a path segment or a query string. Source: RFC 3986 §3.3 (a segment may not contain "/", "?" or "#").

const join = (base: string, parts: readonly (string | number)[]) =>
  [base, ...parts.map((p) => encodeURIComponent(String(p)))].join('/');

/** `/api/channels/<slug>/<parts…>` */
export const channelApi = (slug: string, ...parts: (string | number)[]) => join('/api/channels', [slug, ...parts]);

/** `/api/<parts…>` for routes outside a channel (sign-up, profile, invitations). */
export const api = (...parts: (string | number)[]) => join('/api', parts);

/** `/c/<slug>/<parts…>`: a page of the signed-in app. */
export const channelPage = (slug: string, ...parts: (string | number)[]) => join('/c', [slug, ...parts]);
