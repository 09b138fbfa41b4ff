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

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  serverExternalPackages: ['knex', 'pg', 'bcryptjs', 'nodemailer'],
  experimental: { authInterrupts: true },
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'Content-Security-Policy', value: csp },
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
