import type { Request, Response } from 'express';
import cookieParser from 'cookie-parser';

/**
 * req.cookies (and req.signedCookies) as cookie-parser makes them, but only for a request that
 * reads them: the CSRF check of a change, the CSRF token of GET /api/session, express-session when
 * the header holds no session cookie of its own. Most API reads never look, and cookie-parser run
 * as a middleware parses every request's Cookie header (~0.6 % of node time in the read-mix
 * profile). The getter sits on the app's request prototype; the first read runs cookie-parser's
 * own middleware on the request (it is synchronous) and leaves the result as the request's own
 * properties, so later reads and writes are plain ones.
 */
export function parseCookiesWhenRead(requestPrototype: Request): void {
  const parse = cookieParser();
  const own = (req: Request, name: 'cookies' | 'signedCookies', value: unknown) =>
    Object.defineProperty(req, name, { value, writable: true, configurable: true, enumerable: true });
  const parsed = (req: Request) => {
    // cookie-parser leaves alone a request whose req.cookies is already set.
    own(req, 'cookies', undefined);
    parse(req, undefined as unknown as Response, () => undefined);
  };
  for (const name of ['cookies', 'signedCookies'] as const) {
    Object.defineProperty(requestPrototype, name, {
      configurable: true,
      get(this: Request) {
        parsed(this);
        return this[name];
      },
      set(this: Request, value: unknown) {
        own(this, name, value);
      },
    });
  }
}
