import fs from 'node:fs';
import path from 'node:path';
import express from 'express';
import type { Sequelize } from 'sequelize';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import { projectRoot } from './config/env';
import { toHandler } from './http/define-route';
import type { AnyRouteSpec } from './http/define-route';
import { buildOpenApiDocument } from './http/openapi';
import { appVersion } from './lib/version';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { apiRoutes } from './routes';

export interface AppServices {
  sequelize: Sequelize;
  embeddedDatabase: boolean;
}

export interface CreateAppOptions extends AppServices {
  logger: Logger;
  /** Folder of the built client; defaults to dist/ in the project. */
  clientDir?: string;
  routes?: AnyRouteSpec[];
}

/** Builds the Express application without listening (server/index.ts listens; tests import this). */
export function createApp(options: CreateAppOptions): express.Express {
  const routes = options.routes ?? apiRoutes;
  const app = express();
  app.disable('x-powered-by');
  app.locals.services = { sequelize: options.sequelize, embeddedDatabase: options.embeddedDatabase };

  app.use(pinoHttp({ logger: options.logger, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  app.use('/api', express.json({ limit: '1mb' }));

  app.locals.openApiDocument = buildOpenApiDocument(routes, appVersion);
  for (const route of routes) {
    app[route.method](route.path, ...(route.middleware ?? []), toHandler(route));
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
