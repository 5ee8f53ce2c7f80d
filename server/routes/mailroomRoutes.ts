import { Router } from 'express';
import type { SmtpSink } from '../mail/smtpSink';

/**
 * The Mailroom: what the local SMTP sink caught, for development and demos.
 * Open without sign-in on purpose (it is how a reset link is read when no
 * real mail exists); mounted only while the sink is in use, never with a real relay.
 */
export function mailroomRoutes(sink: SmtpSink): Router {
  const router = Router();
  router.get('/mailroom', (_req, res) => {
    res.json({ messages: sink.messages() });
  });
  router.delete('/mailroom', (_req, res) => {
    sink.clear();
    res.status(204).end();
  });
  return router;
}
