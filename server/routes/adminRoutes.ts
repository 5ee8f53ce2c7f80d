import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import { currentUser, requireUser } from '../auth/requireUser';
import { forbidden } from '../http/HttpError';
import { parseBody, parseParams, uuid } from '../http/validate';
import type { Services } from '../services/Services';

const onlyAdmins: RequestHandler = (_req, res, next) => {
  if (currentUser(res).siteRole !== 'admin') throw forbidden('only site admins manage accounts');
  next();
};

const patch = z
  .object({
    name: z.string().trim().min(1).max(100).optional(),
    siteRole: z.enum(['admin', 'member']).optional(),
    disabled: z.boolean().optional(),
  })
  .refine((p) => Object.values(p).some((v) => v !== undefined), { message: 'nothing to change: give name, siteRole or disabled' });

/** Account management: `GET /api/admin/users`, `PATCH /api/admin/users/:id`. Project access is granted through the members routes. */
export function adminRoutes(services: Services): Router {
  const router = Router();
  router.use('/admin', requireUser(services.auth), onlyAdmins);

  router.get('/admin/users', async (_req, res) => {
    res.json({ users: await services.admin.listUsers() });
  });

  router.patch('/admin/users/:id', async (req, res) => {
    const { id } = parseParams(z.object({ id: uuid }), req);
    res.json({ user: await services.admin.patchUser(id, parseBody(patch, req)) });
  });

  return router;
}
