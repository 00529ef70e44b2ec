import express, { type Express } from 'express';
import compression from 'compression';
import type { Sequelize } from 'sequelize';
import type { ServerConfig } from './config';
import type { Mailer } from './services/mail/mailer';
import { securityHeaders } from './middleware/security';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { clientApp } from './middleware/client-app';
import { jsonDepthLimit } from './middleware/json-depth';
import { absoluteTimeout, configurePassport, passport, sessionMiddleware } from './middleware/session';
import { csrfProtection } from './middleware/csrf';
import { healthRoutes } from './routes/health';
import { authRoutes } from './routes/auth';
import { sketchRoutes } from './routes/sketches';
import { sharedRoutes } from './routes/shared';
import { uploadRoutes } from './routes/uploads';
import { adminRoutes } from './routes/admin';
import { sweepRoutes } from './routes/sweep';
import { classRoutes } from './routes/classes';
import { inviteRoutes } from './routes/invites';
import { assignmentRoutes } from './routes/assignments';
import { JSON_BODY_MAX_BYTES } from '../shared/schema/requestLimits';
import { RequestGate } from './shutdown';

/**
 * Answers smaller than this go uncompressed. An answer of a few KB (a sketch, a page of the library) reaches the
 * browser in the same round trip either way, as it fits TCP's initial window (10 segments, about 14 KB, RFC 6928),
 * while compressing it cost the server more CPU than the rest of a signed-in sketch read (a compressor is set up and
 * torn down for every answer). Larger answers (sweeps, exports, the client's scripts) are still compressed.
 */
const COMPRESS_FROM_BYTES = 8 * 1024;

/** What the app needs from outside: the open (migrated) database, the settings and the mailer. */
export interface AppContext {
  sequelize: Sequelize;
  config: ServerConfig;
  mailer: Mailer;
  /** Counts the requests in flight and refuses new ones once a shutdown begins (server/shutdown.ts). */
  gate?: RequestGate;
}

/** Builds the Express app (no listening; tests drive it with supertest). */
export function createApp(ctx: AppContext): Express {
  const { config, mailer } = ctx;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.set('query parser', 'simple');
  // First of all: a request that arrives while the server shuts down gets its 503 before it touches anything.
  app.use((ctx.gate ?? new RequestGate()).admit);

  app.use(securityHeaders({ https: config.cookieSecure }));
  app.use(compression({ threshold: COMPRESS_FROM_BYTES }));

  const api = express.Router();
  api.use(express.json({ limit: JSON_BODY_MAX_BYTES }));
  api.use(jsonDepthLimit);
  api.use(healthRoutes(ctx.sequelize));
  configurePassport();
  api.use(sessionMiddleware(ctx.sequelize, config));
  api.use(passport.initialize());
  api.use(passport.session());
  api.use(absoluteTimeout(config));
  // Every state-changing call below (uploads included) needs the X-CSRF-Token of GET /api/auth/csrf.
  const csrf = csrfProtection(config);
  api.use(csrf.protection);
  api.use('/auth', authRoutes(config, mailer, csrf));
  api.use(uploadRoutes(config));
  api.use('/sketches', sketchRoutes(config, mailer));
  api.use('/shared', sharedRoutes(config));
  api.use('/admin', adminRoutes());
  api.use(sweepRoutes(config));
  api.use('/classes', classRoutes(config, mailer));
  api.use('/invites', inviteRoutes());
  api.use(assignmentRoutes(config, mailer));
  api.use(apiNotFound);
  app.use('/api', api);

  const client = clientApp(config.distDir);
  if (client) app.use(client);

  app.use(errorHandler);
  return app;
}
