import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import { currentUser, requireUser } from '../auth/requireUser';
import { email, parseBody, parseParams, projectRole, uuid } from '../http/validate';
import { canManage, type Need } from '../services/ProjectAccess';
import type { Services } from '../services/Services';
import { projectAccess, withProject } from './withProject';

const memberParams = z.object({ id: uuid, userId: uuid });

/** The Crew: /api/projects/:id/members and pending invitations. */
export function memberRoutes(services: Services): Router {
  const router = Router();
  const signedIn = requireUser(services.auth);
  const { members, access } = services;

  router.get('/projects/:id/members', signedIn, withProject(access, 'read'), async (_req, res) => {
    const { project, standing } = projectAccess(res);
    res.json(await members.list(project.id, canManage(standing)));
  });

  router.post('/projects/:id/members', signedIn, withProject(access, 'manage'), async (req, res) => {
    const body = parseBody(z.object({ email, role: projectRole }), req);
    const { status, body: answer } = await members.add(currentUser(res), projectAccess(res).project, body.email, body.role);
    res.status(status).json(answer);
  });

  router.patch('/projects/:id/members/:userId', signedIn, withProject(access, 'manage'), async (req, res) => {
    const { id, userId } = parseParams(memberParams, req);
    const { role } = parseBody(z.object({ role: projectRole }), req);
    res.json({ member: await members.changeRole(currentUser(res), id, userId, role) });
  });

  // Owners and admins remove anyone; every member may leave.
  const removing = (req: Request, res: Response): Need => (currentUser(res).id === req.params.userId ? 'read' : 'manage');
  router.delete('/projects/:id/members/:userId', signedIn, withProject(access, removing), async (req, res) => {
    const { id, userId } = parseParams(memberParams, req);
    await members.remove(currentUser(res), id, userId);
    res.status(204).end();
  });

  router.delete('/projects/:id/invitations/:invitationId', signedIn, withProject(access, 'manage'), async (req, res) => {
    const { id, invitationId } = parseParams(z.object({ id: uuid, invitationId: uuid }), req);
    await members.revokeInvitation(currentUser(res), id, invitationId);
    res.status(204).end();
  });

  return router;
}
