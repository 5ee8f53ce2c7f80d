import cors from 'cors';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { ServerConfig } from './config';
import { errorMiddleware } from './http/errorMiddleware';
import type { SmtpSink } from './mail/smtpSink';
import { adminRoutes } from './routes/adminRoutes';
import { auditRoutes } from './routes/auditRoutes';
import { authRoutes } from './routes/authRoutes';
import { invitationRoutes } from './routes/invitationRoutes';
import { mailroomRoutes } from './routes/mailroomRoutes';
import { memberRoutes } from './routes/memberRoutes';
import { projectRoutes } from './routes/projectRoutes';
import { syncRoutes } from './routes/syncRoutes';
import { uploadRoutes } from './routes/uploadRoutes';
import type { Services } from './services/Services';
import { mountStaticApp } from './staticApp';

export interface AppOptions {
  /** The built client to serve; overrides `config.distDir`. */
  distDir?: string;
  config?: ServerConfig;
  /** Without services only /api/health and the client are served (as the client-only tests and benchmarks need). */
  services?: Services;
  /** The local SMTP sink, when in use: enables /api/mailroom. */
  sink?: SmtpSink;
}

/**
 * The one process users start: the API under /api and the built client.
 * `createServer` wires the services; this only assembles the HTTP layer.
 */
export function createApp({ distDir, config, services, sink }: AppOptions = {}): Express {
  const app = express();
  app.disable('x-powered-by');
  if (config && config.trustProxy !== false) app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'worker-src': ["'self'", 'blob:'],
          'img-src': ["'self'", 'data:', 'blob:'],
          'connect-src': ["'self'"],
        },
      },
    }),
  );
  if (config) app.use('/api', cors({ origin: [config.appOrigin], methods: ['GET', 'POST', 'PATCH', 'DELETE'], maxAge: 600 }));
  app.use('/api', express.json({ limit: '2mb' }));

  app.get('/api/health', (_req, res) => {
    res.json({ ok: true });
  });
  if (config && services) mountApi(app, config, services);
  if (sink) app.use('/api', mailroomRoutes(sink));
  app.use('/api', (_req, res) => {
    res.status(404).json({ error: 'no such API route' });
  });
  app.use(errorMiddleware());
  const clientDir = distDir ?? config?.distDir;
  if (clientDir) mountStaticApp(app, clientDir);
  return app;
}

function mountApi(app: Express, config: ServerConfig, services: Services): void {
  app.use('/api', authRoutes(services, config.rateLimit));
  app.use('/api', projectRoutes(services));
  app.use('/api', memberRoutes(services));
  app.use('/api', invitationRoutes(services));
  app.use('/api', syncRoutes(services));
  app.use('/api', uploadRoutes(services, config.upload.maxBytes));
  app.use('/api', auditRoutes(services));
  app.use('/api', adminRoutes(services));
}
