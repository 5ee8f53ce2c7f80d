import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { currentUser, requireUser } from '../auth/requireUser';
import { parseParams, uuid } from '../http/validate';
import type { Services } from '../services/Services';
import { projectAccess, withProject } from './withProject';

/** Compressed model payloads: `POST /api/projects/:id/uploads` (multipart field `file`), `GET /api/uploads/:id`. */
export function uploadRoutes(services: Services, maxBytes: number): Router {
  const router = Router();
  const signedIn = requireUser(services.auth);
  // Access is checked before multer reads a byte, so a non-member cannot make the server buffer a payload.
  const receive = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: 1, fields: 10, parts: 12 } }).single('file');

  router.post('/projects/:id/uploads', signedIn, withProject(services.access, 'write'), receive, async (req, res) => {
    res.status(201).json(await services.uploads.create(currentUser(res), projectAccess(res).project.id, req.file));
  });

  router.get('/uploads/:id', signedIn, async (req, res) => {
    const { id } = parseParams(z.object({ id: uuid }), req);
    await services.access.require(currentUser(res), await services.uploads.projectOf(id), 'read');
    const upload = await services.uploads.get(id);
    res.setHeader('Content-Type', upload.mediaType);
    res.setHeader('Content-Length', String(upload.bytes));
    res.setHeader('ETag', `"${upload.sha256}"`);
    res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
    res.end(upload.data);
  });

  return router;
}
