import type {} from 'express-session';
import type { RequestHandler } from 'express';
import { doubleCsrf } from 'csrf-csrf';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import helmet from 'helmet';
import type { ApiErrorBody } from '@shared/schemas/error';

/**
 * Helmet's headers with a content security policy the built client passes: everything from
 * our own origin, inline style attributes (set by the charting and React code), no framing.
 */
export function securityHeaders(secure: boolean): RequestHandler {
  return helmet({
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

export interface RateLimitSettings {
  windowMs: number;
  limit: number;
}

export type RateLimitName = 'signIn' | 'passwordReset' | 'invitation';

export const defaultRateLimits: Record<RateLimitName, RateLimitSettings> = {
  signIn: { windowMs: 15 * 60_000, limit: 10 },
  passwordReset: { windowMs: 60 * 60_000, limit: 5 },
  invitation: { windowMs: 60 * 60_000, limit: 30 },
};

const tooMany: ApiErrorBody = {
  error: { code: 'rate_limited', message: 'Too many attempts in a short time. Wait a few minutes and try again.' },
};

/** Limits per client address; sign-in is counted per address and e-mail together. */
export function createRateLimiters(settings: Record<RateLimitName, RateLimitSettings>) {
  const make = (name: RateLimitName, keyed: (ip: string, body: Record<string, unknown>) => string) =>
    rateLimit({
      windowMs: settings[name].windowMs,
      limit: settings[name].limit,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      keyGenerator: (req) => keyed(ipKeyGenerator(req.ip ?? 'unknown'), (req.body ?? {}) as Record<string, unknown>),
      handler: (_req, res) => {
        res.status(429).json(tooMany);
      },
    });
  return {
    signIn: make(
      'signIn',
      (ip, body) =>
        `${ip}|${String(body.email ?? '')
          .trim()
          .toLowerCase()}`,
    ),
    passwordReset: make('passwordReset', (ip) => ip),
    invitation: make('invitation', (ip) => ip),
  } satisfies Record<RateLimitName, RequestHandler>;
}
