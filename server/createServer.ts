import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import type { DataSource } from 'typeorm';
import { AccessTokens } from './auth/AccessTokens';
import type { ServerConfig } from './config';
import { createDataSource } from './db/createDataSource';
import { seedDemo } from './db/seedDemo';
import { DataSourceTransactor } from './db/Transactor';
import { createApp } from './createApp';
import { SmtpMailer } from './mail/Mailer';
import { startSmtpSink, type SmtpSink } from './mail/smtpSink';
import { AdminService } from './services/AdminService';
import { AuditService } from './services/AuditService';
import { AuthService } from './services/AuthService';
import { systemClock, type Clock } from './services/clock';
import { InvitationService } from './services/InvitationService';
import { MemberService } from './services/MemberService';
import { PasswordResetService } from './services/PasswordResetService';
import { ProjectAccess } from './services/ProjectAccess';
import { ProjectService } from './services/ProjectService';
import type { Services } from './services/Services';
import { SyncService } from './services/SyncService';
import { UploadService } from './services/UploadService';

export interface GluefieldServer {
  app: Express;
  config: ServerConfig;
  dataSource: DataSource;
  services: Services;
  sink?: SmtpSink;
  /** Listen on the configured port (or the one given; 0 picks a free one). */
  listen(port?: number, host?: string): Promise<{ server: Server; port: number }>;
  /** Stop listening, finish queued database work, close the database and the sink. */
  close(): Promise<void>;
}

/**
 * Wire the server: database (migrated), mail (and the local sink when the
 * SMTP host is the default), services, demo seed, Express app.
 */
export async function createServer(config: ServerConfig, clock: Clock = systemClock): Promise<GluefieldServer> {
  const sink = config.smtpSink ? await startSmtpSink(config.smtp.port) : undefined;
  const dataSource = await createDataSource(config.db).catch(async (error: unknown) => {
    await sink?.close();
    throw error;
  });
  const tx = new DataSourceTransactor(dataSource);
  const mailer = new SmtpMailer({ ...config.smtp, port: sink?.port ?? config.smtp.port }, config.mailFrom);
  const tokens = new AccessTokens(config.jwt);
  const auth = new AuthService(tx, tokens, config, clock);
  const sync = new SyncService(tx, clock);
  const services: Services = {
    tokens,
    auth,
    resets: new PasswordResetService(tx, auth, mailer, config, clock),
    access: new ProjectAccess(tx),
    projects: new ProjectService(tx, clock),
    members: new MemberService(tx, mailer, config, clock),
    invitations: new InvitationService(tx, auth, clock),
    sync,
    uploads: new UploadService(tx, clock),
    audit: new AuditService(tx),
    admin: new AdminService(tx, auth, clock),
  };
  if (config.seedDemo) await seedDemo(tx, sync, config.bcryptRounds);
  const app = createApp({ config, services, sink });
  const servers: Server[] = [];

  return {
    app,
    config,
    dataSource,
    services,
    sink,
    listen(port = config.port, host?: string) {
      return new Promise((resolve, reject) => {
        const server = app.listen(port, host ?? '::', () => {
          server.off('error', reject);
          servers.push(server);
          resolve({ server, port: (server.address() as AddressInfo).port });
        });
        server.once('error', reject);
      });
    },
    async close() {
      await Promise.all(servers.map((s) => new Promise<void>((resolve) => {
        s.close(() => resolve());
        s.closeAllConnections();
      })));
      await tx.drain();
      await dataSource.destroy();
      mailer.close();
      await sink?.close();
    },
  };
}
