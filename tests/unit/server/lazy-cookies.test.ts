import cookieParser from 'cookie-parser';
import express from 'express';
import type { RequestHandler } from 'express';
import request from 'supertest';
import { describe, expect, it, vi } from 'vitest';
import { parseCookiesWhenRead } from '../../../server/http/lazy-cookies';

// Counts how often cookie-parser's middleware parses a request.
const parses = vi.hoisted(() => ({ count: 0 }));
vi.mock('cookie-parser', async (importOriginal) => {
  const actual = (await importOriginal<{ default: typeof cookieParser }>()).default;
  const counted = (...args: Parameters<typeof cookieParser>) => {
    const middleware = actual(...args);
    return ((req, res, next) => {
      parses.count += 1;
      middleware(req, res, next);
    }) as RequestHandler;
  };
  return { default: counted };
});

const header = 'halflight.csrf=abc%20def; prefs=j%3A%7B%22unit%22%3A%22mM%22%7D; plain=1';

/** An app whose route reads req.cookies `reads` times and answers with what it saw. */
function lazyApp(reads: number) {
  const app = express();
  parseCookiesWhenRead(app.request);
  app.get('/x', (req, res) => {
    const seen = Array.from({ length: reads }, () => ({ ...req.cookies }));
    res.json({ seen, signed: reads ? { ...req.signedCookies } : null });
  });
  return app;
}

describe('parseCookiesWhenRead', () => {
  it('when a route reads req.cookies, then it sees what cookie-parser gives, parsed once however often it is read', async () => {
    // Reference: cookie-parser's own middleware in front of the same route.
    const eager = express();
    eager.use(cookieParser());
    eager.get('/x', (req, res) => res.json({ seen: [{ ...req.cookies }], signed: { ...req.signedCookies } }));
    const expected = (await request(eager).get('/x').set('cookie', header)).body;
    expect(expected.seen[0]).toEqual({ 'halflight.csrf': 'abc def', prefs: { unit: 'mM' }, plain: '1' });

    const before = parses.count;
    const response = await request(lazyApp(3)).get('/x').set('cookie', header);
    expect(parses.count - before).toBe(1);
    expect(response.body.seen).toEqual([expected.seen[0], expected.seen[0], expected.seen[0]]);
    expect(response.body.signed).toEqual(expected.signed);
  });

  it('when a route reads no cookie, then the Cookie header is not parsed at all', async () => {
    const before = parses.count;
    const response = await request(lazyApp(0)).get('/x').set('cookie', header);
    expect(response.status).toBe(200);
    expect(parses.count - before).toBe(0);
  });

  it('when there is no Cookie header, then req.cookies is empty, as with cookie-parser', async () => {
    const response = await request(lazyApp(1)).get('/x');
    expect(response.body.seen).toEqual([{}]);
  });

  it('when a middleware sets req.cookies, then later reads see that value', async () => {
    const app = express();
    parseCookiesWhenRead(app.request);
    app.get('/x', (req, res) => {
      req.cookies = { given: 'yes' };
      res.json(req.cookies);
    });
    expect((await request(app).get('/x').set('cookie', header)).body).toEqual({ given: 'yes' });
  });
});
