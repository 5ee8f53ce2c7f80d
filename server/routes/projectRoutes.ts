import { Router } from 'express';
import { z } from 'zod';
import { currentUser, requireUser } from '../auth/requireUser';
import { parseBody, parseQuery } from '../http/validate';
import { projectView } from '../services/ProjectService';
import type { Services } from '../services/Services';
import { projectAccess, withProject } from './withProject';

const projectName = z.string().trim().min(1, { message: 'a project needs a name' }).max(200);

/** The Desk: /api/projects and /api/projects/:id. */
export function projectRoutes(services: Services): Router {
  const router = Router();
  const signedIn = requireUser(services.auth);

  router.get('/projects', signedIn, async (req, res) => {
    const { scope } = parseQuery(z.object({ scope: z.enum(['mine', 'all']).default('mine') }), req);
    res.json({ projects: await services.projects.list(currentUser(res), scope === 'all') });
  });

  router.post('/projects', signedIn, async (req, res) => {
    const { name } = parseBody(z.object({ name: projectName }), req);
    res.status(201).json(await services.projects.create(currentUser(res), name));
  });

  router.get('/projects/:id', signedIn, withProject(services.access, 'read'), (_req, res) => {
    const { project, standing } = projectAccess(res);
    res.json(projectView(project, standing));
  });

  router.patch('/projects/:id', signedIn, withProject(services.access, 'manage'), async (req, res) => {
    const { name } = parseBody(z.object({ name: projectName }), req);
    const { project, standing } = projectAccess(res);
    res.json(await services.projects.rename(currentUser(res), project, standing, name));
  });

  return router;
}
