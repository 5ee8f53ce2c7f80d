import { Router } from 'express';
import { rateLimit, ipKeyGenerator, type Options } from 'express-rate-limit';
import { z } from 'zod';
import { passwordSchema } from '../auth/passwords';
import { requireUser, currentUser } from '../auth/requireUser';
import type { ServerConfig } from '../config';
import { email, parseBody } from '../http/validate';
import type { Services } from '../services/Services';
import { userView } from '../services/views';

const name = z.string().trim().min(1, { message: 'a name is required' }).max(100);
const token = z.string().min(20).max(200);

/** Per client address and account, so one noisy address cannot lock everyone else out. */
function limiter(windowMs: number, limit: number) {
  const options: Partial<Options> = {
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? 'unknown')}|${String(req.body?.email ?? '').toLowerCase()}`,
    handler: (_req, res) => {
      res.status(429).json({ error: 'too many attempts; wait a while and try again' });
    },
  };
  return rateLimit(options);
}

/** Accounts and sessions: /api/auth/* and /api/me. */
export function authRoutes(services: Services, limits: ServerConfig['rateLimit']): Router {
  const router = Router();
  const { auth, resets } = services;

  router.post('/auth/register', async (req, res) => {
    const body = parseBody(z.object({ email, password: passwordSchema, name }), req);
    res.status(201).json(await auth.register(body));
  });

  router.post('/auth/login', limiter(limits.windowMs, limits.login), async (req, res) => {
    const body = parseBody(z.object({ email, password: z.string().min(1).max(200) }), req);
    res.json(await auth.login(body));
  });

  router.post('/auth/refresh', async (req, res) => {
    const body = parseBody(z.object({ refreshToken: token }), req);
    res.json(await auth.refresh(body.refreshToken));
  });

  router.post('/auth/logout', async (req, res) => {
    const body = parseBody(z.object({ refreshToken: token }), req);
    await auth.logout(body.refreshToken);
    res.status(204).end();
  });

  const resetLimit = limiter(limits.windowMs, limits.reset);
  router.post('/auth/password-reset', resetLimit, async (req, res) => {
    const body = parseBody(z.object({ email }), req);
    await resets.request(body.email);
    // The same answer whether or not the account exists.
    res.status(202).json({ ok: true });
  });

  router.post('/auth/password-reset/confirm', resetLimit, async (req, res) => {
    const body = parseBody(z.object({ token, password: passwordSchema }), req);
    await resets.confirm(body.token, body.password);
    res.json({ ok: true });
  });

  router.get('/me', requireUser(auth), (_req, res) => {
    res.json({ user: userView(currentUser(res)) });
  });

  return router;
}
