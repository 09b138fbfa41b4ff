import 'server-only';
import type { NextRequest } from 'next/server';
import type { z } from 'zod';
import { can, type Capability } from '@/lib/auth/policy';
import { getUserFromRequest } from '@/lib/auth/session';
import { findMembership, type Membership } from '@/lib/channels/queries';
import { appUrl } from '@/lib/config';
import { AppError, forbidden, notFound, toAppError, toErrorBody, unauthenticated } from '@/lib/errors';
import type { UserDto } from '@/lib/users/schemas';
import { refuseCrossSite } from './origin';
import { parseWith, readJsonBody, searchParamsObject } from './validation';

type Auth = 'required' | 'none';
/** 'member': any crew of the channel named by params.channel; a capability: crew whose role has it. */
type ChannelRule = 'member' | Capability;

type Spec<P extends z.ZodType, Q extends z.ZodType, B extends z.ZodType, A extends Auth, C extends ChannelRule | undefined> = {
  auth?: A;
  params?: P;
  query?: Q;
  body?: B;
  channel?: C;
  maxBodyBytes?: number;
};

export type HandlerContext<P extends z.ZodType, Q extends z.ZodType, B extends z.ZodType, A extends Auth, C> = {
  req: NextRequest;
  params: z.output<P>;
  query: z.output<Q>;
  body: z.output<B>;
  user: A extends 'none' ? UserDto | null : UserDto;
  member: C extends ChannelRule ? Membership : null;
};

type RouteContext = { params: Promise<Record<string, string | string[] | undefined>> };

/**
 * The one wrapper for every JSON route: origin of a state change (403) -> session (401) -> params
 * (404), query and body (400) -> channel membership (404) and role (403) -> handler -> JSON. Any
 * other failure is logged and 500.
 */
export function route<
  P extends z.ZodType = z.ZodType<Record<string, never>>,
  Q extends z.ZodType = z.ZodType<Record<string, never>>,
  B extends z.ZodType = z.ZodType<undefined>,
  A extends Auth = 'required',
  C extends ChannelRule | undefined = undefined,
>(spec: Spec<P, Q, B, A, C>, handler: (ctx: HandlerContext<P, Q, B, A, C>) => Promise<unknown>) {
  return async (req: NextRequest, context: RouteContext): Promise<Response> => {
    try {
      const crossSite = refuseCrossSite(req, appUrl());
      if (crossSite) throw crossSite;
      const user = await getUserFromRequest(req);
      if ((spec.auth ?? 'required') === 'required' && !user) throw unauthenticated();

      const rawParams = (await context.params) ?? {};
      const params = spec.params ? parseParams(spec.params, rawParams) : {};
      const query = spec.query ? parseWith(spec.query, searchParamsObject(req.nextUrl)) : {};
      const body = spec.body ? parseWith(spec.body, await readJsonBody(req, spec.maxBodyBytes)) : undefined;

      let member: Membership | null = null;
      if (spec.channel) {
        const slug = (params as { channel?: unknown }).channel;
        if (typeof slug !== 'string' || !user) throw notFound('That channel');
        member = await findMembership(slug, user.id);
        if (!member) throw notFound('That channel');
        if (spec.channel !== 'member' && !can(member.role, spec.channel)) throw forbidden();
      }

      const result = await handler({ req, params, query, body, user, member } as HandlerContext<P, Q, B, A, C>);
      return result instanceof Response ? result : Response.json(result ?? null);
    } catch (err) {
      return errorResponse(err, req);
    }
  };
}

function parseParams<P extends z.ZodType>(schema: P, raw: unknown): z.output<P> {
  const result = schema.safeParse(raw);
  // A malformed id in a URL names nothing that exists.
  if (!result.success) throw notFound();
  return result.data;
}

export function errorResponse(err: unknown, req?: Request): Response {
  const appError = toAppError(err);
  if (appError.code === 'internal') {
    console.error(`[api] ${req?.method ?? ''} ${req ? new URL(req.url).pathname : ''} failed`, appError.cause ?? err);
  }
  const headers: HeadersInit = appError.code === 'too_many_requests' ? { 'retry-after': String(appError.retryAfterSeconds ?? 60) } : {};
  return Response.json(toErrorBody(appError), { status: appError.status, headers });
}

export const created = (data: unknown) => Response.json(data, { status: 201 });
export const noContent = () => new Response(null, { status: 204 });
export { AppError };
