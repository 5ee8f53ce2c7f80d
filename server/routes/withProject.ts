import type { Request, RequestHandler, Response } from 'express';
import { z } from 'zod';
import { currentUser } from '../auth/requireUser';
import { parseParams, uuid } from '../http/validate';
import type { Access, Need, ProjectAccess } from '../services/ProjectAccess';

/** Resolve `:id` to a project the user may use as `need` requires (404 for non-members, 403 for too small a role). */
export function withProject(access: ProjectAccess, need: Need | ((req: Request, res: Response) => Need)): RequestHandler {
  return async (req, res, next) => {
    const { id } = parseParams(z.object({ id: uuid }).loose(), req);
    res.locals.access = await access.require(currentUser(res), id, typeof need === 'function' ? need(req, res) : need);
    next();
  };
}

export function projectAccess(res: Response): Access {
  return res.locals.access as Access;
}
