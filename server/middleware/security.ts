import type {} from 'express-session';
import type { RequestHandler } from 'express';
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
  return doubleCsrf({
    getSecret: () => secret,
    getSessionIdentifier: (req) => req.session?.id ?? '',
    cookieName: secure ? '__Host-halflight.csrf' : 'halflight.csrf',
    cookieOptions: { sameSite: 'strict', secure, httpOnly: true, path: '/' },
    getCsrfTokenFromRequest: (req) => req.headers['x-csrf-token'],
  });
}
