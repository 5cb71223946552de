import type { RequestHandler } from 'express';

/**
 * Several middlewares run one after another as one: what `app.use(path, a, b, c)` does, without a
 * router layer for each. Express's router gives every layer its own path match and prefix strip
 * (req.url cut and restored, so parseurl parses it anew each time); for the ten middlewares every
 * API request passes through, that was a good part of the router's ~4 % of node time in the
 * read-mix profile. Each middleware is called as the router's layer calls it (router 2,
 * lib/layer.js handleRequest): an error passed to next, thrown, or a rejected promise it returns
 * skips the rest and goes on to the error handlers.
 */
export function inOrder(handlers: RequestHandler[]): RequestHandler {
  return (req, res, done) => {
    let index = 0;
    const next = (error?: unknown): void => {
      if (error) return done(error);
      const handler = handlers[index++];
      if (!handler) return done();
      try {
        const returned = handler(req, res, next) as unknown;
        if (returned instanceof Promise) {
          returned.then(undefined, (rejection: unknown) => next(rejection || new Error('Rejected promise')));
        }
      } catch (thrown) {
        next(thrown);
      }
    };
    next();
  };
}
