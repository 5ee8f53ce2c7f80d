import { Router } from 'express';
import { z } from 'zod';
import { optionalUser } from '../auth/requireUser';
import { passwordSchema } from '../auth/passwords';
import { parseBody, parseParams } from '../http/validate';
import type { UserRow } from '../db/entities';
import type { Services } from '../services/Services';

const tokenParams = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{20,200}$/) });

/**
 * The invitation link's API: preview, then accept signed in (as the invited
 * address) or, without a token, with `{name, password}` to create the account.
 */
export function invitationRoutes(services: Services): Router {
  const router = Router();

  router.get('/invitations/:token', async (req, res) => {
    const { token } = parseParams(tokenParams, req);
    res.json(await services.invitations.preview(token));
  });

  router.post('/invitations/:token/accept', optionalUser(services.auth), async (req, res) => {
    const { token } = parseParams(tokenParams, req);
    const user = res.locals.user as UserRow | null;
    const signUp = user ? null : parseBody(z.object({ name: z.string().trim().min(1).max(100), password: passwordSchema }), req);
    const result = await services.invitations.accept(token, user, signUp);
    const { session, ...rest } = result;
    res.status(200).json(session ? { ...rest, ...session } : rest);
  });

  return router;
}
