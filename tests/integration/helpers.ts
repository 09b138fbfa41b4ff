import { randomUUID } from 'node:crypto';
import { encode } from 'next-auth/jwt';
import { NextRequest } from 'next/server';
import { db } from '@/db/client';
import { hashPassword } from '@/lib/auth/password';
import { PEER_HEADER } from '@/lib/http/peer';
import type { Role } from '@/lib/auth/policy';
import { createChannel } from '@/lib/channels/queries';
import type { ChannelDto } from '@/lib/channels/schemas';
import type { UserDto } from '@/lib/users/schemas';

export const BASE = process.env.APP_URL ?? 'http://127.0.0.1:3100';
export const PASSWORD = 'correct-horse-battery';

export const uniqueEmail = (label = 'person') => `${label}-${randomUUID().slice(0, 8)}@it.kerfline.test`;

export async function makeUser(label = 'person', password = PASSWORD): Promise<UserDto> {
  const email = uniqueEmail(label);
  const [row] = await db('users')
    .insert({ email, name: `Test ${label}`, password_hash: await hashPassword(password) })
    .returning<UserDto[]>(['id', 'email', 'name']);
  if (!row) throw new Error('no user');
  return row;
}

export async function addMember(channel: ChannelDto, user: UserDto, role: Role): Promise<void> {
  await db('memberships').insert({ channel_id: channel.id, user_id: user.id, role });
}

/** A channel with one person in each role. */
export async function makeCrew() {
  const host = await makeUser('host');
  const shopHand = await makeUser('shop');
  const editor = await makeUser('editor');
  const channel = await createChannel(`Bench ${randomUUID().slice(0, 6)}`, host.id);
  await addMember(channel, shopHand, 'shop_hand');
  await addMember(channel, editor, 'editor');
  return { channel, host, shopHand, editor };
}

/**
 * A real next-auth session cookie, signed with the same secret the app uses. `session` adds what
 * sign-in puts there (lib/auth/options.ts): a session id and the user's session version.
 */
export async function sessionCookie(user: UserDto, session: { sid?: string; sv?: number } = {}): Promise<string> {
  const token = await encode({ token: { sub: user.id, email: user.email, name: user.name, ...session }, secret: process.env.NEXTAUTH_SECRET ?? '' });
  return `next-auth.session-token=${token}`;
}

type RouteFn = (req: NextRequest, ctx: { params: Promise<Record<string, string | string[] | undefined>> }) => Promise<Response>;

export type CallOptions = {
  params?: Record<string, string>;
  as?: UserDto | null;
  body?: unknown;
  rawBody?: string;
  headers?: Record<string, string>;
  path?: string;
};

/** The Origin a Kerfline page sends; every state-changing request must carry one of ours. */
export const ORIGIN = new URL(BASE).origin;

export async function call(fn: RouteFn, method: string, opts: CallOptions = {}) {
  const headers = new Headers(opts.headers);
  // As a browser does: Origin on every request from a Kerfline page. A test passes its own to differ.
  if (!headers.has('origin')) headers.set('origin', ORIGIN);
  else if (headers.get('origin') === '') headers.delete('origin'); // `origin: ''` sends none, as a script might
  // Each call is its own client (as the server tags it in instrumentation.ts) unless the test names one,
  // so the per-address throttles of one test do not spill into the next.
  if (!headers.has(PEER_HEADER)) headers.set(PEER_HEADER, `2001:db8:${randomUUID().slice(0, 4)}::${randomUUID().slice(0, 4)}`);
  if (opts.as) headers.set('cookie', await sessionCookie(opts.as));
  let body: string | undefined = opts.rawBody;
  if (opts.body !== undefined) {
    body = JSON.stringify(opts.body);
    if (!headers.has('content-type')) headers.set('content-type', 'application/json');
  }
  const req = new NextRequest(new URL(opts.path ?? '/api/test', BASE), { method, headers, body });
  const res = await fn(req, { params: Promise.resolve(opts.params ?? {}) });
  const text = await res.text();
  // Bytes (clip files, posters) are not JSON; only JSON answers are parsed.
  const isJson = /json/i.test(res.headers.get('content-type') ?? '');
  const json: unknown = text && isJson ? JSON.parse(text) : null;
  return { status: res.status, json: json as Record<string, unknown> & { error?: { code: string; message: string; fields?: Record<string, string> } } };
}
