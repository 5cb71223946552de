import fs from 'node:fs';
import type { ServerResponse } from 'node:http';
import path from 'node:path';
import zlib from 'node:zlib';
import compression from 'compression';
import express from 'express';
import expressStaticGzip from 'express-static-gzip';
import type { Request, RequestHandler, Response } from 'express';
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import { createPassport, sessionUser } from './auth/passport';
import { createSessionMiddleware, enforceSessionLifetime } from './auth/session';
import { projectRoot } from './config/env';
import { toHandler } from './http/define-route';
import { compressWhenAccepted } from './http/compress-when-accepted';
import { createHandlersInProgress } from './http/handlers-in-progress';
import { inOrder } from './http/in-order';
import { parseCookiesWhenRead } from './http/lazy-cookies';
import { weakEtag } from './http/weak-etag';
import type { AnyRouteSpec, RouteAccess } from './http/define-route';
import { logRedactPaths } from './http/log-redaction';
import { requestLogging } from './http/request-log';
import { buildOpenApiDocument } from './http/openapi';
import { countDatabaseTime } from './db/database-time';
import { createJobQueue } from './jobs/job-queue';
import type { JobQueue } from './jobs/job-queue';
import { appVersion } from './lib/version';
import { registerMailJobs } from './mail/mail-jobs';
import type { Mailer } from './mail/mailer';
import { requireAuth, requireLabRole } from './middleware/access';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { createRateLimits, defaultRateLimits } from './middleware/rate-limits';
import type { RateLimitName, RateLimits, RateLimitSettings } from './middleware/rate-limits';
import { createReadAdmission, defaultReadAdmission } from './middleware/read-admission';
import type { ReadAdmission, ReadAdmissionSettings } from './middleware/read-admission';
import { csrfProtection, securityHeaders } from './middleware/security';
import { apiRoutes } from './routes';
import { createRawFileStore, type RawFileStore } from './services/studies/files/raw-file-store';
import { createUploadReader, type UploadReader } from './services/studies/parse/upload-reader';
import type { UploadLimits } from './services/studies/parse/upload-limits';

export interface AppServices {
  sequelize: Sequelize;
  embeddedDatabase: boolean;
  /** Background jobs in PostgreSQL; every e-mail goes through it. */
  jobs: JobQueue;
  /** Attempt counters in PostgreSQL (sign-in failures, resets, hash work). */
  rateLimits: RateLimits;
  /** True when outgoing mail goes to the local catcher (people read their own in the app). */
  mailCatcher: boolean;
  /** Base address for links in e-mails, e.g. http://127.0.0.1:4310 */
  publicUrl: string;
  passport: ReturnType<typeof createPassport>;
  generateCsrfToken: (req: Request, res: Response, options?: { overwrite?: boolean }) => string;
  sessionCookieName: string;
  /** Threads that read uploaded files under the upload limits. */
  uploadReader: UploadReader;
  /** Where raw upload files are kept (the database, or S3-compatible object storage). */
  files: RawFileStore;
  /** The turns of API reads (GET/HEAD) of this process: how many run and how many wait. */
  readAdmission: ReadAdmission;
}

export interface CreateAppOptions {
  sequelize: Sequelize;
  embeddedDatabase: boolean;
  logger: Logger;
  databaseUrl: string;
  sessionSecret: string;
  /** Where the job worker sends e-mail (an SMTP relay or the local catcher). */
  mailer: Mailer;
  mailCatcher: boolean;
  publicUrl: string;
  /**
   * Run the background job worker (e-mail) in this process; default true. With several instances
   * on one database, any number may run it: each job is claimed by exactly one.
   */
  jobWorker?: boolean;
  /** First retry delay of a failed job in seconds (default 5; tests use 1). */
  jobRetryDelaySeconds?: number;
  /** Behind a TLS-terminating proxy: secure cookies, HSTS. */
  behindTls?: boolean;
  /**
   * Which proxies' X-Forwarded-For to believe for the client address: a hop count or the
   * proxies' addresses/subnets (Express "trust proxy"). Default: none, the socket's address.
   */
  trustProxy?: number | string[] | false;
  rateLimits?: Partial<Record<RateLimitName, RateLimitSettings>>;
  /** Absolute lifetime of a sign-in in ms (default 7 days), besides the 12-hour idle timeout. */
  sessionAbsoluteMs?: number;
  /** Prefix of the attempt counters; instances that should count together share it (default "halflight"). */
  rateLimitNamespace?: string;
  /** Folder of the built client; defaults to dist/client/ in the project. */
  clientDir?: string;
  routes?: AnyRouteSpec[];
  /** Tighter (or looser) limits for reading uploaded files; the defaults suit real instrument files. */
  uploadLimits?: Partial<UploadLimits>;
  /** Where raw upload files go; the default keeps them in the database. */
  files?: RawFileStore;
  /** Session store connections: for session reads, and for session writes (default 5 and 2). */
  sessionPools?: { read: number; write: number };
  /** API reads of this process that run at once, and that may wait (default 4 and 500). */
  readAdmission?: Partial<ReadAdmissionSettings>;
}

export interface HalflightApp extends express.Express {
  /** Starts the job queue (and its worker where enabled); sending a job also starts it. */
  startJobs(): Promise<void>;
  /** Closes what the app opened itself (job queue, the session store's connection pool). */
  closeResources(): Promise<void>;
  /**
   * Resolves true once no API route handler is running (also those whose client has gone away),
   * or false at `deadline` (ms since the epoch). Stopping waits for it before closeResources.
   */
  handlersSettled(deadline: number): Promise<boolean>;
}

const apiCompression = compression({
  threshold: 1024,
  level: zlib.constants.Z_BEST_SPEED,
  brotli: { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 4 } },
});

/**
 * Vite names every file under assets/ after a hash of its content, so a changed file has a new
 * name: those are cached for a year and never revalidated. Everything else (fonts at fixed names,
 * favicon) is revalidated each time.
 */
const staticCacheHeaders = (clientDir: string) => (res: ServerResponse, filePath: string) => {
  const immutable = path.relative(clientDir, filePath).startsWith(`assets${path.sep}`);
  res.setHeader('Cache-Control', immutable ? 'public, max-age=31536000, immutable' : 'no-cache');
};

function accessGuards(access: RouteAccess): RequestHandler[] {
  if (access === 'public') return [];
  if (access === 'signed-in') return [requireAuth];
  return [requireLabRole(access.lab)];
}

/** Builds the Express application without listening (server/index.ts listens; tests import this). */
export function createApp(options: CreateAppOptions): HalflightApp {
  const routes = options.routes ?? apiRoutes;
  const logger = options.logger.child({}, { redact: { paths: logRedactPaths, censor: '[Redacted]' } });
  const secure = options.behindTls ?? false;
  const app = express() as HalflightApp;
  app.disable('x-powered-by');
  app.set('trust proxy', options.trustProxy ?? false);
  app.set('etag', weakEtag);

  const session = createSessionMiddleware({
    databaseUrl: options.databaseUrl,
    secret: options.sessionSecret,
    secure,
    logger: options.logger,
    pools: options.sessionPools,
  });
  const passport = createPassport();
  const csrf = csrfProtection(options.sessionSecret, secure);
  const rateLimits = createRateLimits(
    options.sequelize,
    { ...defaultRateLimits, ...options.rateLimits },
    options.rateLimitNamespace,
  );
  const publicUrl = options.publicUrl.replace(/\/$/, '');
  const jobs = createJobQueue({
    databaseUrl: options.databaseUrl,
    sequelize: options.sequelize,
    logger,
    runWorker: options.jobWorker ?? true,
    retryDelaySeconds: options.jobRetryDelaySeconds,
  });
  registerMailJobs(jobs, { sequelize: options.sequelize, mailer: options.mailer, publicUrl, logger });
  const uploadReader = createUploadReader({ limits: options.uploadLimits });
  const readAdmission = createReadAdmission({ ...defaultReadAdmission, ...options.readAdmission });
  app.locals.services = {
    sequelize: options.sequelize,
    embeddedDatabase: options.embeddedDatabase,
    jobs,
    rateLimits,
    mailCatcher: options.mailCatcher,
    publicUrl,
    passport,
    generateCsrfToken: csrf.generateCsrfToken,
    sessionCookieName: session.cookieName,
    uploadReader,
    files: options.files ?? createRawFileStore({ writeTo: 'database', s3: null }),
    readAdmission,
  } satisfies AppServices;
  app.locals.openApiDocument = buildOpenApiDocument(routes, appVersion);
  const handlers = createHandlersInProgress();
  app.handlersSettled = (deadline) => handlers.settled(deadline);
  app.startJobs = () => jobs.start();
  app.closeResources = async () => {
    await jobs.stop();
    await Promise.all([session.close(), uploadReader.close()]);
  };

  const logDatabaseTime = logger.isLevelEnabled('debug');
  app.use(requestLogging(app.request, logger, options.logger, { databaseTime: logDatabaseTime }));
  if (logDatabaseTime) app.use(countDatabaseTime);
  app.use(securityHeaders(secure));
  parseCookiesWhenRead(app.request);
  // Everything under /api passes through these, in this order (one router layer, see inOrder).
  app.use(
    '/api',
    inOrder([
      // Before the session: a read waiting for its turn holds no connection and has read nothing yet.
      readAdmission.middleware,
      // API answers: gzip or brotli (fast settings) above 1 KB when the client accepts it. Each answer
      // is private to the person and revalidated with its ETag (304 when unchanged), never stored by proxies.
      compressWhenAccepted(apiCompression),
      (_req, res, next) => {
        res.setHeader('Cache-Control', 'private, no-cache');
        next();
      },
      express.json({ limit: '1mb' }),
      ...session.middleware,
      sessionUser(passport, app.request),
      enforceSessionLifetime(options.sessionAbsoluteMs),
      csrf.doubleCsrfProtection,
    ]),
  );

  for (const route of routes) {
    const limiter = route.rateLimit ? [rateLimits.guards[route.rateLimit]] : [];
    app[route.method](route.path, ...accessGuards(route.access), ...limiter, handlers.track(toHandler(route)));
  }
  app.use('/api', apiNotFound);

  const clientDir = options.clientDir ?? path.join(projectRoot, 'dist', 'client');
  const indexHtml = path.join(clientDir, 'index.html');
  app.use(
    expressStaticGzip(clientDir, {
      index: false,
      enableBrotli: true,
      orderPreference: ['br', 'gzip'],
      serveStatic: { setHeaders: staticCacheHeaders(clientDir) },
    }),
  );
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
