import type {} from 'express-session';
import type { Request, RequestHandler, Response } from 'express';
import { doubleCsrf } from 'csrf-csrf';
import helmet from 'helmet';

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
 * Helmet's headers plus a Permissions-Policy, with a content security policy the built client
 * passes: everything from our own origin, inline style attributes (set by the charting and React
 * code), no framing.
 */
export function securityHeaders(secure: boolean): RequestHandler {
  const helmetHeaders = helmet({
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
  });
  return (req, res, next) => {
    res.setHeader('Permissions-Policy', permissionsPolicy);
    helmetHeaders(req, res, next);
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
