import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import type { RequestHandler } from 'express';
import { Lucia, type Session, type User } from 'lucia';
import type { MemberRole } from '../features/auth/schema';
import type { Db } from '../db/client';
import { members, sessions } from '../db/schema';
import { HttpError } from './errors';

/** A session ends this long after sign-in however active it stays; lucia's sliding 30 days ends idle ones. */
export const SESSION_ABSOLUTE_LIFETIME_MS = 30 * 24 * 60 * 60 * 1000;

export function createAuth(db: Db, secureCookies: boolean) {
  const adapter = new DrizzlePostgreSQLAdapter(db, sessions, members);
  return new Lucia(adapter, {
    sessionCookie: { name: 'matwright_session', attributes: { secure: secureCookies, sameSite: 'lax' } },
    getUserAttributes: (row) => ({ shopId: row.shopId, email: row.email, name: row.name, role: row.role }),
    getSessionAttributes: (row) => ({ signedInAt: row.signedInAt }),
  });
}

/** Starts a session for a member who just proved who they are; returns the Set-Cookie value. */
export async function startSession(auth: Auth, memberId: string): Promise<string> {
  const session = await auth.createSession(memberId, { signedInAt: new Date() });
  return auth.createSessionCookie(session.id).serialize();
}

export type Auth = ReturnType<typeof createAuth>;

declare module 'lucia' {
  interface Register {
    Lucia: Auth;
    DatabaseUserAttributes: { shopId: string; email: string; name: string; role: MemberRole };
    DatabaseSessionAttributes: { signedInAt: Date };
  }
}

declare global {
  namespace Express {
    interface Locals {
      user: User | null;
      session: Session | null;
    }
  }
}

export { hashPassword, verifyPassword } from './security/passwordHashing';

/**
 * Reads the session cookie on every request and refreshes it when lucia asks;
 * a session past its absolute lifetime is ended here, however recently it was used.
 */
export function sessionMiddleware(auth: Auth, absoluteLifetimeMs = SESSION_ABSOLUTE_LIFETIME_MS): RequestHandler {
  return async (req, res, next) => {
    const id = auth.readSessionCookie(req.headers.cookie ?? '');
    res.locals.user = null;
    res.locals.session = null;
    if (!id) return next();
    let { session, user } = await auth.validateSession(id);
    if (session && session.signedInAt.getTime() + absoluteLifetimeMs <= Date.now()) {
      await auth.invalidateSession(session.id);
      session = null;
      user = null;
    }
    if (session?.fresh) res.append('Set-Cookie', auth.createSessionCookie(session.id).serialize());
    if (!session) res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
    res.locals.user = user;
    res.locals.session = session;
    next();
  };
}

/** Refuses cross-site form posts: a state-changing request whose Origin is another host. */
export const sameOriginOnly: RequestHandler = (req, _res, next) => {
  if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return next();
  const origin = req.headers.origin;
  if (!origin) return next();
  let originHost = '';
  try {
    originHost = new URL(origin).host;
  } catch {
    // An unreadable Origin is treated like a foreign one.
  }
  if (originHost !== req.headers.host) return next(new HttpError(403, 'cross_origin', 'Requests from another site are refused'));
  next();
};

/** Lets the request through only for a signed-in member holding one of `roles` (any role when empty). */
export function requireMember(...roles: MemberRole[]): RequestHandler {
  return (_req, res, next) => {
    const user = res.locals.user;
    if (!user) return next(new HttpError(401, 'signed_out', 'Sign in to continue'));
    if (roles.length > 0 && !roles.includes(user.role)) {
      return next(new HttpError(403, 'role_refused', `This needs one of these roles: ${roles.join(', ')}`));
    }
    next();
  };
}

/** The signed-in member; only call after `requireMember`. */
export function currentMember(locals: { user: User | null }): User {
  if (!locals.user) throw new Error('currentMember called on a route without requireMember');
  return locals.user;
}
