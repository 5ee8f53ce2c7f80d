import { Router } from 'express';
import { currentUser, requireUser } from '../auth/requireUser';
import { parseBody, parseQuery } from '../http/validate';
import type { Services } from '../services/Services';
import { pullQuery, pushSchema } from './syncSchemas';
import { projectAccess, withProject } from './withProject';

/** Sync: pull `GET /api/projects/:id/changes?since=REV`, push `POST /api/projects/:id/changes`. */
export function syncRoutes(services: Services): Router {
  const router = Router();
  const signedIn = requireUser(services.auth);

  router.get('/projects/:id/changes', signedIn, withProject(services.access, 'read'), async (req, res) => {
    const { since, limit } = parseQuery(pullQuery, req);
    res.json(await services.sync.pull(projectAccess(res).project.id, since, limit));
  });

  router.post('/projects/:id/changes', signedIn, withProject(services.access, 'write'), async (req, res) => {
    const { changes } = parseBody(pushSchema, req);
    res.json(await services.sync.push(currentUser(res), projectAccess(res).project.id, changes));
  });

  return router;
}
