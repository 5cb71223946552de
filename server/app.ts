import fs from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express from 'express';
import type { Request, RequestHandler, Response } from 'express';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Sequelize } from 'sequelize';
import { createPassport } from './auth/passport';
import { createSessionMiddleware } from './auth/session';
import { projectRoot } from './config/env';
import { toHandler } from './http/define-route';
import type { AnyRouteSpec, RouteAccess } from './http/define-route';
import { buildOpenApiDocument } from './http/openapi';
import { appVersion } from './lib/version';
import type { Mailer } from './mail/mailer';
import { requireAuth, requireLabRole } from './middleware/access';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { createRateLimiters, csrfProtection, defaultRateLimits, securityHeaders } from './middleware/security';
import type { RateLimitName, RateLimitSettings } from './middleware/security';
import { apiRoutes } from './routes';

export interface AppServices {
  sequelize: Sequelize;
  embeddedDatabase: boolean;
  mailer: Mailer;
  /** True when outgoing mail goes to the local catcher (admins can read it in the app). */
  mailCatcher: boolean;
  /** Base address for links in e-mails, e.g. http://127.0.0.1:4310 */
  publicUrl: string;
  passport: ReturnType<typeof createPassport>;
  generateCsrfToken: (req: Request, res: Response, options?: { overwrite?: boolean }) => string;
  sessionCookieName: string;
}

export interface CreateAppOptions {
  sequelize: Sequelize;
  embeddedDatabase: boolean;
  logger: Logger;
  databaseUrl: string;
  sessionSecret: string;
  mailer: Mailer;
  mailCatcher: boolean;
  publicUrl: string;
  /** Behind a TLS-terminating proxy: secure cookies, HSTS, trust X-Forwarded-*. */
  behindTls?: boolean;
  rateLimits?: Partial<Record<RateLimitName, RateLimitSettings>>;
  /** Folder of the built client; defaults to dist/ in the project. */
  clientDir?: string;
  routes?: AnyRouteSpec[];
}

export interface HalflightApp extends express.Express {
  /** Closes what the app opened itself (the session store's connection pool). */
  closeResources(): Promise<void>;
}

function accessGuards(access: RouteAccess): RequestHandler[] {
  if (access === 'public') return [];
  if (access === 'signed-in') return [requireAuth];
  return [requireLabRole(access.lab)];
}

/** Builds the Express application without listening (server/index.ts listens; tests import this). */
export function createApp(options: CreateAppOptions): HalflightApp {
  const routes = options.routes ?? apiRoutes;
  const secure = options.behindTls ?? false;
  const app = express() as HalflightApp;
  app.disable('x-powered-by');
  if (secure) app.set('trust proxy', 1);

  const session = createSessionMiddleware({ databaseUrl: options.databaseUrl, secret: options.sessionSecret, secure });
  const passport = createPassport();
  const csrf = csrfProtection(options.sessionSecret, secure);
  const limiters = createRateLimiters({ ...defaultRateLimits, ...options.rateLimits });
  app.locals.services = {
    sequelize: options.sequelize,
    embeddedDatabase: options.embeddedDatabase,
    mailer: options.mailer,
    mailCatcher: options.mailCatcher,
    publicUrl: options.publicUrl.replace(/\/$/, ''),
    passport,
    generateCsrfToken: csrf.generateCsrfToken,
    sessionCookieName: session.cookieName,
  };
  app.locals.openApiDocument = buildOpenApiDocument(routes, appVersion);
  app.closeResources = session.close;

  app.use(pinoHttp({ logger: options.logger, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  app.use(securityHeaders(secure));
  app.use('/api', express.json({ limit: '1mb' }), cookieParser(), session.middleware, passport.session());
  app.use('/api', csrf.doubleCsrfProtection);

  for (const route of routes) {
    const limiter = route.rateLimit ? [limiters[route.rateLimit]] : [];
    app[route.method](route.path, ...accessGuards(route.access), ...limiter, toHandler(route));
  }
  app.use('/api', apiNotFound);

  const clientDir = options.clientDir ?? path.join(projectRoot, 'dist');
  const indexHtml = path.join(clientDir, 'index.html');
  app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
  // Client-side routes (anything not under /api) get the single-page app.
  app.get(/^(?!\/api(\/|$)).*/, (_req, res) => {
    if (fs.existsSync(indexHtml)) {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(indexHtml);
    } else {
      res.status(503).type('text/plain').send('The Halflight client is not built yet: run "npm run build".');
    }
  });

  app.use(errorHandler);
  return app;
}
