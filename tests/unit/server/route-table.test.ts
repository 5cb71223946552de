import { createRequire } from 'node:module';
import express from 'express';
import type { ErrorRequestHandler, RequestHandler } from 'express';
import request from 'supertest';
import { describe, expect, it, vi } from 'vitest';
import type { HttpMethod } from '../../../server/http/define-route';
import { routeTable } from '../../../server/http/route-table';

/** A handler that answers with what it saw (or, for `pass`, hands the request to the next route). */
const answer =
  (name: string, pass = false): RequestHandler =>
  (req, res, next) => {
    if (pass) return next();
    res.json({ name, params: req.params, path: req.path, routePath: req.route?.path, baseUrl: req.baseUrl });
  };

const routes: Array<{ method: HttpMethod; path: string; handlers: RequestHandler[] }> = [
  { method: 'get', path: '/api/health', handlers: [answer('health')] },
  { method: 'get', path: '/api/labs/:labId/things', handlers: [answer('list things')] },
  { method: 'post', path: '/api/labs/:labId/things', handlers: [answer('add a thing')] },
  // A parameter and a fixed segment at the same place: the one declared first wins.
  { method: 'get', path: '/api/labs/:labId/things/:thingId', handlers: [answer('one thing', true)] },
  { method: 'get', path: '/api/labs/:labId/things/newest', handlers: [answer('newest thing')] },
  { method: 'get', path: '/api/labs/:labId/things/:thingId', handlers: [answer('one thing, second route')] },
  { method: 'delete', path: '/api/labs/:labId/things/:thingId', handlers: [answer('remove a thing')] },
  { method: 'get', path: '/api/labs/:labId/things/:thingId/export.csv', handlers: [answer('export')] },
  // Not a plain path (optional part): tried on every request.
  { method: 'get', path: '/api/files{/:name}', handlers: [answer('files')] },
  {
    method: 'get',
    path: '/api/fails/:id',
    handlers: [
      () => {
        throw new Error('the handler failed');
      },
    ],
  },
];

/** The routes registered one by one on the app (as the app did), or through the route table. */
function appWith(mount: 'express' | 'table') {
  const app = express();
  if (mount === 'express') for (const route of routes) app[route.method](route.path, ...route.handlers);
  else app.use(routeTable(routes));
  app.use('/api', (req, res) => {
    res.status(404).json({ notFound: `${req.method} ${req.originalUrl}` });
  });
  const onError: ErrorRequestHandler = (error: Error & { status?: number }, _req, res, _next) => {
    res.status(error.status ?? 500).json({ error: error.message });
  };
  app.use(onError);
  return app;
}

const asked: Array<[string, string]> = [
  ['GET', '/api/health'],
  ['GET', '/api/health/'],
  ['GET', '/api/health//'],
  ['GET', '/API/Health'],
  ['GET', '/api//health'],
  ['GET', '/api/health?verbose=1'],
  ['HEAD', '/api/health'],
  ['OPTIONS', '/api/health'],
  ['OPTIONS', '/api/labs/l1/things'],
  ['POST', '/api/health'],
  ['GET', '/api/labs/l1/things'],
  ['POST', '/api/labs/l1/things'],
  ['PUT', '/api/labs/l1/things'],
  ['HEAD', '/api/labs/l1/things'],
  ['GET', '/api/labs/l1/things/newest'],
  ['GET', '/api/labs/l1/things/NEWEST'],
  ['GET', '/api/labs/l1/things/t%20two'],
  ['GET', '/api/labs/l%2F1/things/t2'],
  ['GET', '/api/labs/%E0%A4%A/things'],
  ['DELETE', '/api/labs/l1/things/t2'],
  ['DELETE', '/api/labs/l1/things/t2/'],
  ['GET', '/api/labs/l1/things/t2/export.csv'],
  ['GET', '/api/labs/l1/things/t2/exportxcsv'],
  ['GET', '/api/labs//things'],
  ['GET', '/api/labs/l1'],
  ['GET', '/api/files'],
  ['GET', '/api/files/a.txt'],
  ['GET', '/api/fails/1'],
  ['GET', '/api/nothing'],
  ['GET', '/api'],
  ['GET', '/'],
];

describe('routeTable', () => {
  const byExpress = appWith('express');
  const byTable = appWith('table');

  it.each(asked)(
    'when %s %s is asked, then it gets the answer the routes registered one by one gave',
    async (method, url) => {
      const send = (app: express.Express) => request(app)[method.toLowerCase() as 'get'](url);
      const [expected, got] = [await send(byExpress), await send(byTable)];
      expect({ status: got.status, body: got.body, allow: got.headers.allow }).toEqual({
        status: expected.status,
        body: expected.body,
        allow: expected.headers.allow,
      });
    },
  );

  it('when a request is routed, then only the routes whose path can fit it are matched (not every route declared before)', async () => {
    const many = [
      ...Array.from({ length: 100 }, (_, i) => ({
        method: 'get' as const,
        path: `/api/labs/:labId/kind-${i}/:id`,
        handlers: [answer(`kind ${i}`)],
      })),
      { method: 'get' as const, path: '/api/labs/:labId/last', handlers: [answer('last')] },
    ];
    // The layer class of the router Express uses (router 2, lib/layer.js): match() tests one layer's path.
    const Layer = createRequire(createRequire(import.meta.url).resolve('express'))('router/lib/layer.js') as {
      prototype: { match(path: string): unknown; route?: unknown };
    };
    const routeMatchesFor = async (app: express.Express) => {
      let matches = 0;
      const plainMatch = Layer.prototype.match;
      const spy = vi.spyOn(Layer.prototype, 'match').mockImplementation(function (this: { route?: unknown }, path) {
        if (this.route) matches += 1;
        return plainMatch.call(this, path);
      });
      try {
        const response = await request(app).get('/api/labs/l1/last');
        expect(response.body.name).toBe('last');
        return matches;
      } finally {
        spy.mockRestore();
      }
    };
    const oneByOne = express();
    for (const route of many) oneByOne.get(route.path, ...route.handlers);
    const table = express();
    table.use(routeTable(many));
    expect(await routeMatchesFor(oneByOne)).toBe(101);
    expect(await routeMatchesFor(table)).toBe(1);
  });
});
