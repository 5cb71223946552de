import type { Request, RequestHandler, Response } from 'express';
import type * as Helmet from 'helmet';
import { describe, expect, it, vi } from 'vitest';
import { helmetOptions, securityHeaders } from '../../../server/middleware/security';

// Counts how often helmet's own middleware runs, and keeps the real one to compare with.
const helmetRuns = vi.hoisted(() => ({
  count: 0,
  real: undefined as undefined | ((options: object) => RequestHandler),
}));
vi.mock('helmet', async (importOriginal) => {
  const actual = await importOriginal<typeof Helmet>();
  helmetRuns.real = actual.default as unknown as (options: object) => RequestHandler;
  return {
    ...actual,
    default: (options: object) => {
      const middleware = helmetRuns.real!(options);
      return (req: Request, res: Response, next: (error?: unknown) => void) => {
        helmetRuns.count += 1;
        middleware(req, res, next);
      };
    },
  };
});

/** Runs a middleware on a response that keeps its headers, as node's would (names without case). */
function headersAfter(middleware: RequestHandler, headers = new Map<string, string>()) {
  const res = {
    setHeader: (name: string, value: unknown) => headers.set(name.toLowerCase(), String(value)),
    removeHeader: (name: string) => headers.delete(name.toLowerCase()),
  };
  let nextCalls = 0;
  middleware({} as Request, res as unknown as Response, () => (nextCalls += 1));
  return { headers, nextCalls };
}

describe('securityHeaders', () => {
  it.each([false, true])(
    'when behind TLS is %s, then each response gets exactly the headers helmet itself sets, plus a Permissions-Policy',
    (secure) => {
      // Reference: the helmet package's own middleware with the same options, run per response.
      const reference = headersAfter(helmetRuns.real!(helmetOptions(secure)));
      const ours = headersAfter(securityHeaders(secure));
      expect(ours.nextCalls).toBe(1);
      const { 'permissions-policy': permissions, ...rest } = Object.fromEntries(ours.headers);
      expect(rest).toEqual(Object.fromEntries(reference.headers));
      expect(permissions).toContain('camera=()');
      expect(rest['content-security-policy']).toContain("frame-ancestors 'none'");
      expect(rest['content-security-policy']?.includes('upgrade-insecure-requests')).toBe(secure);
      expect('strict-transport-security' in rest).toBe(secure);
      expect(rest['x-content-type-options']).toBe('nosniff');
    },
  );

  it('when a response already carries X-Powered-By, then it is removed, as helmet does', () => {
    const { headers } = headersAfter(securityHeaders(false), new Map([['x-powered-by', 'Express']]));
    expect(headers.has('x-powered-by')).toBe(false);
  });

  it('when many responses are served, then helmet ran once, at start, and not once per response', () => {
    const middleware = securityHeaders(false);
    const before = helmetRuns.count;
    for (let i = 0; i < 3; i++) headersAfter(middleware);
    expect(helmetRuns.count).toBe(before);
  });
});
