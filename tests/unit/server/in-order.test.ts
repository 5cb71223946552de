import express from 'express';
import type { ErrorRequestHandler, RequestHandler } from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { inOrder } from '../../../server/http/in-order';

type Step = 'next' | 'throw' | 'next-error' | 'reject' | 'async-next';

/** A middleware that notes what it saw (as the router shows it under /api) and then does `step`. */
const middleware =
  (name: string, step: Step): RequestHandler =>
  (req, res, next) => {
    (res.locals.seen as string[]).push(`${name} ${req.baseUrl} ${req.url}`);
    if (step === 'next') return next();
    if (step === 'throw') throw new Error(`${name} threw`);
    if (step === 'next-error') return next(new Error(`${name} failed`));
    if (step === 'reject') return Promise.reject(new Error(`${name} rejected`)) as never;
    return Promise.resolve().then(() => next()) as never;
  };

/** The same middlewares mounted at /api as separate router layers (Express itself) or through inOrder. */
function appWith(mount: 'express' | 'inOrder', steps: Step[]) {
  const app = express();
  app.use((_req, res, next) => {
    res.locals.seen = [];
    next();
  });
  const handlers = steps.map((step, i) => middleware(`m${i}`, step));
  if (mount === 'express') app.use('/api', ...handlers);
  else app.use('/api', inOrder(handlers));
  app.get('/api/things/:id', (req, res) => {
    res.json({ seen: res.locals.seen, id: req.params.id, url: req.url, path: req.path });
  });
  const onError: ErrorRequestHandler = (error: Error, _req, res, _next) => {
    res.status(500).json({ seen: res.locals.seen, error: error.message });
  };
  app.use(onError);
  return app;
}

describe('inOrder', () => {
  it.each<[string, Step[]]>([
    ['all pass on', ['next', 'next', 'async-next', 'next']],
    ['the second throws', ['next', 'throw', 'next']],
    ['the second hands an error to next', ['next', 'next-error', 'next']],
    ['the first returns a rejected promise', ['reject', 'next']],
    ['an asynchronous one hands on and a later one fails', ['async-next', 'next-error']],
  ])(
    'when %s, then the request goes on (or fails) exactly as with one router layer per middleware',
    async (_, steps) => {
      // Reference: Express 5's own router with the same middlewares as separate layers.
      const expected = await request(appWith('express', steps)).get('/api/things/7?x=1');
      const actual = await request(appWith('inOrder', steps)).get('/api/things/7?x=1');
      expect(actual.status).toBe(expected.status);
      expect(actual.body).toEqual(expected.body);
    },
  );

  it('when all pass on, then each saw the path under /api, in order, and the route the whole address', async () => {
    const response = await request(appWith('inOrder', ['next', 'async-next'])).get('/api/things/7?x=1');
    expect(response.body).toEqual({
      seen: ['m0 /api /things/7?x=1', 'm1 /api /things/7?x=1'],
      id: '7',
      url: '/api/things/7?x=1',
      path: '/api/things/7',
    });
  });
});
