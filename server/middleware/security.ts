import type {} from 'express-session';
import type { Request, RequestHandler, Response } from 'express';
import { doubleCsrf } from 'csrf-csrf';
import helmet from 'helmet';
import type { HelmetOptions } from 'helmet';

// Powerful browser features the app never uses are switched off for it and anything it embeds.
const permissionsPolicy = [
  'accelerometer=()',
  'autoplay=()',
  'camera=()',
  'display-capture=()',
  'geolocation=()',
  'gyroscope=()',
  'magnetometer=()',
  'microphone=()',
  'midi=()',
  'payment=()',
  'publickey-credentials-get=()',
  'usb=()',
  'fullscreen=(self)',
].join(', ');

/**
 * Helmet's options: a content security policy the built client passes (everything from our own
 * origin, inline style attributes set by the charting and React code, no framing), HSTS behind TLS.
 */
export function helmetOptions(secure: boolean): HelmetOptions {
  return {
    contentSecurityPolicy: {
      useDefaults: true,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        upgradeInsecureRequests: secure ? [] : null,
      },
    },
    strictTransportSecurity: secure,
  };
}

/** What a middleware did to a response's headers, in order: set (name, value) or removed (name). */
export type HeaderChange = [name: string, value: string | undefined];

/**
 * Runs helmet once, at start, on a response that only records, and gives back what it did. None
 * of our options depends on the request (no nonce, no function directive), so every response gets
 * the same headers; helmet's middleware is synchronous (helmet 8, index.js).
 */
export function helmetHeaderChanges(options: HelmetOptions): HeaderChange[] {
  const changes: HeaderChange[] = [];
  const recorder = {
    setHeader: (name: string, value: unknown) => changes.push([name, String(value)]),
    removeHeader: (name: string) => changes.push([name, undefined]),
  };
  let done = false;
  helmet(options)({} as Request, recorder as unknown as Response, (error?: unknown) => {
    if (error) throw error;
    done = true;
  });
  if (!done) throw new Error('helmet did not finish synchronously: its headers cannot be set once at start.');
  return changes;
}

/**
 * Helmet's headers plus a Permissions-Policy. Helmet runs its own chain of a dozen middlewares on
 * each request; its headers are the same for every response, so they are worked out once and each
 * request only sets them.
 */
export function securityHeaders(secure: boolean): RequestHandler {
  const changes: HeaderChange[] = [
    ['Permissions-Policy', permissionsPolicy],
    ...helmetHeaderChanges(helmetOptions(secure)),
  ];
  return (_req, res, next) => {
    for (const [name, value] of changes) {
      if (value === undefined) res.removeHeader(name);
      else res.setHeader(name, value);
    }
    next();
  };
}

/** Double-submit CSRF tokens bound to the session id; the client sends them in x-csrf-token. */
export function csrfProtection(secret: string, secure: boolean) {
  const cookieName = secure ? '__Host-halflight.csrf' : 'halflight.csrf';
  const cookieOptions = { sameSite: 'strict', secure, httpOnly: true, path: '/' } as const;
  const csrf = doubleCsrf({
    getSecret: () => secret,
    getSessionIdentifier: (req) => req.session?.id ?? '',
    cookieName,
    cookieOptions,
    getCsrfTokenFromRequest: (req) => req.headers['x-csrf-token'],
  });
  // csrf-csrf sets its cookie on every call, even when it hands back the token the browser already
  // holds (still valid for this session): GET /api/session, asked on every screen load, answered
  // with a Set-Cookie each time. The cookie is sent only when the token is a new one.
  const noCookie = { cookie: () => undefined } as unknown as Response;
  const generateCsrfToken = (req: Request, res: Response, options?: { overwrite?: boolean }): string => {
    const token = csrf.generateCsrfToken(req, noCookie, options);
    if (req.cookies?.[cookieName] !== token) res.cookie(cookieName, token, cookieOptions);
    return token;
  };
  return { doubleCsrfProtection: csrf.doubleCsrfProtection, generateCsrfToken };
}
