import { AppError } from '@/lib/errors';

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export const CROSS_SITE_MESSAGE =
  'This request did not come from a Kerfline page (its Origin is missing or another site’s), so nothing was changed. Reload Kerfline and try again.';

type OriginCheck = { method: string; headers: Headers; ownOrigins: string[] };

/**
 * Cross-site request forgery guard for every state-changing request. Browsers send Origin on
 * every POST, PUT, PATCH and DELETE, same-origin ones included (Source: Fetch Standard, "append a
 * request `Origin` header"; OWASP CSRF Prevention Cheat Sheet, "Verifying Origin with standard
 * headers"), so a request that changes state must name one of our origins. Without Origin it may
 * pass only when it carries no cookie (a script or curl with no session can act as nobody) and
 * Sec-Fetch-Site, when sent, says it came from us or from no page at all.
 */
export function crossSiteRefusal({ method, headers, ownOrigins }: OriginCheck): AppError | null {
  if (!STATE_CHANGING.has(method.toUpperCase())) return null;
  const origin = headers.get('origin');
  if (origin !== null) return ownOrigins.includes(origin) ? null : refusal();
  const site = headers.get('sec-fetch-site');
  if (site !== null && site !== 'same-origin' && site !== 'none') return refusal();
  if (headers.has('cookie')) return refusal();
  return null;
}

const refusal = () => new AppError('forbidden', CROSS_SITE_MESSAGE);

/**
 * The origins a request may come from: the configured public URL, and the origin the browser
 * addressed (the Host header with the request's scheme: a cross-site page cannot change Host).
 */
export function ownOrigins(appUrl: string, requestUrl: string, host?: string | null): string[] {
  const out = new Set<string>();
  const add = (u: string) => {
    try {
      out.add(new URL(u).origin);
    } catch {
      // An unparsable URL names no origin.
    }
  };
  add(appUrl);
  add(requestUrl);
  if (host) {
    try {
      add(`${new URL(requestUrl).protocol}//${host}`);
    } catch {
      // No usable request URL: the configured origin alone.
    }
  }
  return [...out];
}

/** The guard as route code calls it, for a Fetch API request. */
export function refuseCrossSite(req: Request, appUrl: string): AppError | null {
  return crossSiteRefusal({ method: req.method, headers: req.headers, ownOrigins: ownOrigins(appUrl, req.url, req.headers.get('host')) });
}
