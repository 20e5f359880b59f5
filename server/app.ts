import express, { type Express } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import pinoHttp from 'pino-http';
import type { Sequelize } from 'sequelize';
import type { Config } from './config';
import { apiNotFound, errorHandler } from './errors';
import { installAuth } from './http/auth';
import { originCheck } from './http/csrf';
import { initModels } from './models';
import { registerAuthRoutes } from './routes/auth';
import { registerCrewRoutes } from './routes/crew';
import { registerHealthRoutes } from './routes/health';
import { registerHullRoutes } from './routes/hulls';
import { registerExportRoutes } from './routes/exports';
import { registerPartRoutes } from './routes/parts';
import { registerPlanRoutes } from './routes/plans';
import { createMailer } from './mail/mailer';
import { registerAccountRoutes } from './routes/account';
import { registerDevMailRoutes } from './routes/dev-mail';
import { registerInvitationRoutes } from './routes/invitations';
import { registerLibraryRoutes } from './routes/library';
import { registerNoticeRoutes } from './routes/notices';
import { registerBuildLogRoutes } from './routes/build-log';

export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
}

/**
 * Build the Express app without listening: tests drive it with supertest, server/index.ts listens.
 * Every API route is registered on the one `api` router with its full path, so the permission-matrix
 * test can list them all from the router itself.
 */
export function createApp({ config, sequelize }: AppDeps): Express {
  initModels(sequelize);
  const app = express();
  app.disable('x-powered-by');
  if (config.trustProxy) app.set('trust proxy', 1);
  app.locals.mailer = createMailer(config.mail, config.logLevel);

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          workerSrc: ["'self'", 'blob:'],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: config.trustProxy ? [] : null,
        },
      },
      // Plain-HTTP on a workshop LAN is a supported set-up; HSTS only makes sense behind HTTPS.
      strictTransportSecurity: config.trustProxy,
    }),
  );
  // One JSON line per request is for a production log collector; in the demo it would bury the terminal.
  app.use(pinoHttp({ level: config.logLevel, autoLogging: config.mode === 'production' }));
  app.use(express.json({ limit: '4mb' }));
  installAuth(app, config, sequelize);
  app.use(originCheck(config));

  const api = express.Router();
  registerHealthRoutes(api, sequelize);
  registerAuthRoutes(api);
  registerHullRoutes(api);
  registerCrewRoutes(api);
  registerPlanRoutes(api);
  registerPartRoutes(api);
  registerExportRoutes(api);
  registerInvitationRoutes(api, config);
  registerAccountRoutes(api, config);
  registerLibraryRoutes(api, config);
  registerNoticeRoutes(api);
  registerBuildLogRoutes(api, config);
  // The page that shows what the local fake SMTP server received exists only outside production.
  if (config.mode !== 'production') registerDevMailRoutes(api, config);
  app.use(api);
  app.use('/api', apiNotFound);

  if (config.clientDir && existsSync(path.join(config.clientDir, 'index.html'))) {
    const clientDir = path.resolve(config.clientDir);
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    // Client-side routes: any other GET that wants a page gets the app.
    app.use((req, res, next) => {
      if (req.method !== 'GET' || !req.accepts('html')) return next();
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(path.join(clientDir, 'index.html'));
    });
  }
  app.use(errorHandler);
  return app;
}
