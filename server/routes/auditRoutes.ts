import { Router } from 'express';
import { z } from 'zod';
import { requireUser } from '../auth/requireUser';
import { parseQuery } from '../http/validate';
import type { Services } from '../services/Services';
import { projectAccess, withProject } from './withProject';

/** The Logbook: `GET /api/projects/:id/audit?before=ID&limit=N`, newest first. */
export function auditRoutes(services: Services): Router {
  const router = Router();
  const query = z.object({
    before: z.coerce.number().int().min(1).optional(),
    limit: z.coerce.number().int().min(1).max(500).default(100),
  });
  router.get('/projects/:id/audit', requireUser(services.auth), withProject(services.access, 'read'), async (req, res) => {
    const { before, limit } = parseQuery(query, req);
    res.json(await services.audit.list(projectAccess(res).project.id, { before, limit }));
  });
  return router;
}
