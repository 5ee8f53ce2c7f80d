import type { RequestHandler, Response } from 'express';
import type { UserRow } from '../db/entities';
import { unauthorized } from '../http/HttpError';
import type { AuthService } from '../services/AuthService';

/** The bearer token of a request, if it sent one. */
export function bearerToken(header: string | undefined): string | null {
  const match = /^Bearer\s+(\S+)$/i.exec(header ?? '');
  return match ? match[1] : null;
}

/** Answer 401 unless the request carries a valid access token of an enabled account; the user lands in `res.locals.user`. */
export function requireUser(auth: AuthService): RequestHandler {
  return async (req, res, next) => {
    const token = bearerToken(req.headers.authorization);
    if (!token) throw unauthorized('sign in first: send Authorization: Bearer <access token>');
    res.locals.user = await auth.authenticate(token);
    next();
  };
}

/** Like {@link requireUser}, but a request without a token passes through as nobody. */
export function optionalUser(auth: AuthService): RequestHandler {
  return async (req, res, next) => {
    const token = bearerToken(req.headers.authorization);
    res.locals.user = token ? await auth.authenticate(token) : null;
    next();
  };
}

export function currentUser(res: Response): UserRow {
  const user = res.locals.user as UserRow | undefined;
  if (!user) throw unauthorized();
  return user;
}
