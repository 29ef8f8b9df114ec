import type { NextResponse } from 'next/server';
import type { z } from 'zod';
import { currentUser } from '@/lib/auth/guard';
import { roleCan, type Permission } from '@/lib/auth/policy';
import { isCrossSite } from '@/lib/auth/request-info';
import type { SessionUser } from '@/lib/auth/roles';
import { HttpError } from './errors';
import { idFromParam } from './ids';
import { readBody, readQuery } from './parse';
import { errorResponse } from './responses';

// The route kit: every API handler is `export const POST = route({ permission, ids, body }, handler)`.
// In this order it refuses a cross-site state change (403), checks the permission against the one
// table in lib/auth/policy.ts (401 signed out, 403 wrong role), turns path ids into numbers (404),
// validates the query and the JSON body with zod (400/413/422 naming the field), runs the handler,
// and answers any HttpError the handler throws. Anything else is a bug and reaches Next as a 500.

type IdLabels = Record<string, string>;
type Schema = z.ZodType | undefined;
type Output<S extends Schema> = S extends z.ZodType ? z.output<S> : undefined;

export type RouteSpec<P extends Permission | 'public', I extends IdLabels, B extends Schema, Q extends Schema> = {
  /** Who may call it: a row of the permission table, or 'public' (no session needed). */
  permission: P;
  /** Path parameters that are record ids, with the word the 404 uses: `{ id: 'cam' }`. */
  ids?: I;
  body?: B;
  query?: Q;
  /** Largest JSON body accepted, in bytes (default: the kit's JSON limit). */
  bodyLimitBytes?: number;
  /**
   * Skip the cross-site check: the payments webhook (server to server) and the customer's checkout posts,
   * whose page sends no referrer (its address holds the private token), so its own form arrives with
   * `Origin: null`. Both act only on a secret the caller must already hold (the signature, the token).
   */
  allowCrossSite?: boolean;
};

export type RouteContext<P extends Permission | 'public', I extends IdLabels, B extends Schema, Q extends Schema> = {
  request: Request;
  user: P extends 'public' ? null : SessionUser;
  ids: { [K in keyof I]: number };
  /** Path parameters that are not ids (tokens), as given. */
  params: Record<string, string>;
  body: Output<B>;
  query: Output<Q>;
};

type NextContext = { params: Promise<Record<string, string | string[]>> };

export function route<
  P extends Permission | 'public',
  I extends IdLabels = Record<never, string>,
  B extends Schema = undefined,
  Q extends Schema = undefined,
>(
  spec: RouteSpec<P, I, B, Q>,
  handler: (context: RouteContext<P, I, B, Q>) => Promise<Response> | Response,
): (request: Request, context: NextContext) => Promise<Response> {
  return async (request, context) => {
    try {
      if (!spec.allowCrossSite && isCrossSite(request))
        return errorResponse(403, 'This request came from another site and was refused.');
      // Public routes never read the session: the webhook and the health check must not need the database for it.
      const user = spec.permission === 'public' ? null : await currentUser();
      if (spec.permission !== 'public') {
        if (!user) return errorResponse(401, 'Sign in to continue.');
        if (!roleCan(user.role, spec.permission))
          return errorResponse(403, `Your role (${user.role}) does not allow this.`);
      }
      const raw = (await context?.params) ?? {};
      const params = Object.fromEntries(Object.entries(raw).map(([k, v]) => [k, Array.isArray(v) ? v.join('/') : v]));
      const ids = {} as Record<string, number>;
      for (const [name, label] of Object.entries(spec.ids ?? {})) ids[name] = idFromParam(params[name], label);
      const query = spec.query ? readQuery(request, spec.query) : undefined;
      const body = spec.body ? await readBody(request, spec.body, spec.bodyLimitBytes) : undefined;
      return await handler({
        request,
        user: user as RouteContext<P, I, B, Q>['user'],
        ids: ids as RouteContext<P, I, B, Q>['ids'],
        params,
        body: body as Output<B>,
        query: query as Output<Q>,
      });
    } catch (error) {
      if (error instanceof HttpError) return httpErrorResponse(error);
      throw error;
    }
  };
}

export function httpErrorResponse(error: HttpError): NextResponse {
  return errorResponse(error.status, error.message, error.extra, error.headers);
}
