const dev = process.env.NODE_ENV !== 'production';

// Only our own origin. Next's hydration needs inline scripts; dev mode needs eval for fast refresh.
const csp = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${dev ? " 'unsafe-eval'" : ''}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "media-src 'self' blob:",
  "font-src 'self'",
  `connect-src 'self'${dev ? ' ws:' : ''}`,
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

// Source: RFC 6797 §6.1 (Strict-Transport-Security); one year is common practice. Only when the
// public URL is https: an http-only local app must not pin browsers to https. Headers are fixed
// at build time, so scripts/lib/build.mjs rebuilds when the scheme changes.
const hsts = (process.env.NEXTAUTH_URL ?? '').startsWith('https://')
  ? [{ key: 'Strict-Transport-Security', value: 'max-age=31536000; includeSubDomains' }]
  : [];

// app/api/channels/[channel]/clips/[clipId]/file: uploaded bytes, served under `sandbox; default-src 'none'`.
const CLIP_FILE_PATH = 'api/channels/[^/]+/clips/[^/]+/file';

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  serverExternalPackages: ['knex', 'pg', 'bcryptjs', 'nodemailer', 'piscina'],
  experimental: { authInterrupts: true },
  async headers() {
    return [
      {
        // Every path but the clip file route, which answers with its own sandbox CSP: Next applies
        // these headers over a route's own, so the page CSP (inline scripts allowed) must skip it.
        source: `/:path((?!${CLIP_FILE_PATH}$).*)`,
        headers: [{ key: 'Content-Security-Policy', value: csp }],
      },
      {
        source: '/:path*',
        headers: [
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=()' },
          ...hsts,
        ],
      },
    ];
  },
};

export default nextConfig;
