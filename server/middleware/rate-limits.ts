import { createHash } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import type { Sequelize } from 'sequelize';
import { AppError } from '../lib/app-error';

/**
 * Attempt limits kept in PostgreSQL (the rate_limits table), so every instance counts together
 * and a restart forgets nothing. Sign-in counts failures only, per client address and per
 * account, and spends from one ceiling of password-hash work shared by all instances.
 */
export interface RateLimitSettings {
  points: number;
  durationSeconds: number;
}

export type RateLimitName =
  | 'signInFailuresPerIp'
  | 'signInFailuresPerAccount'
  | 'passwordHashes'
  | 'resetRequestsPerIp'
  | 'resetRequestsPerAddress'
  | 'resetCompletionsPerIp'
  | 'invitationsPerAdmin'
  | 'twoFactorFailuresPerAccount';

export const defaultRateLimits: Record<RateLimitName, RateLimitSettings> = {
  // 30 wrong passwords from one address in 15 minutes; a lab behind one proxy still has room.
  signInFailuresPerIp: { points: 30, durationSeconds: 15 * 60 },
  signInFailuresPerAccount: { points: 10, durationSeconds: 15 * 60 },
  // Password checks per minute across all instances (each one is a scrypt run).
  passwordHashes: { points: 600, durationSeconds: 60 },
  resetRequestsPerIp: { points: 30, durationSeconds: 60 * 60 },
  resetRequestsPerAddress: { points: 5, durationSeconds: 60 * 60 },
  resetCompletionsPerIp: { points: 30, durationSeconds: 60 * 60 },
  // Enough for an admin inviting a whole class in one sitting.
  invitationsPerAdmin: { points: 300, durationSeconds: 60 * 60 },
  twoFactorFailuresPerAccount: { points: 5, durationSeconds: 15 * 60 },
};

/** The guards a route can name in defineRoute({ rateLimit }). */
export type RouteRateLimit = 'signIn' | 'passwordReset' | 'passwordResetCompletion' | 'invitation' | 'twoFactor';

function tooMany(msBeforeNext: number): AppError {
  const minutes = Math.max(1, Math.ceil(msBeforeNext / 60_000));
  const error = new AppError(
    'rate_limited',
    `Too many attempts in a short time. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
    429,
  );
  return Object.assign(error, { retryAfterSeconds: Math.ceil(msBeforeNext / 1000) });
}

/**
 * The counter key of an address: a SHA-256 digest of the address as typed (trimmed, lower case).
 * The rate_limits table then holds no addresses, and text PostgreSQL cannot store (NUL, a lone
 * surrogate) never reaches it before the route's own validation answers 400.
 */
const accountKey = (address: string) => createHash('sha256').update(address.trim().toLowerCase()).digest('base64url');

const emailOf = (req: Request) => {
  const email = (req.body as Record<string, unknown> | undefined)?.email;
  return typeof email === 'string' && email.trim() ? accountKey(email) : '';
};

export function createRateLimits(
  sequelize: Sequelize,
  settings: Record<RateLimitName, RateLimitSettings>,
  namespace = 'halflight',
) {
  const limiters = Object.fromEntries(
    (Object.keys(settings) as RateLimitName[]).map((name) => [
      name,
      new RateLimiterPostgres({
        storeClient: sequelize,
        storeType: 'sequelize',
        tableName: 'rate_limits',
        tableCreated: true,
        keyPrefix: `${namespace}:${name}`,
        points: settings[name].points,
        duration: settings[name].durationSeconds,
      }),
    ]),
  ) as Record<RateLimitName, RateLimiterPostgres>;

  /** Spends one point; over the limit, a 429 with Retry-After. */
  async function consume(name: RateLimitName, key: string): Promise<void> {
    try {
      await limiters[name].consume(key);
    } catch (rejection) {
      if (rejection instanceof RateLimiterRes) throw tooMany(rejection.msBeforeNext);
      throw rejection;
    }
  }

  /** Refuses when the counter is already used up, without spending (failures are spent later). */
  async function assertRoom(name: RateLimitName, key: string): Promise<void> {
    const state = await limiters[name].get(key);
    if (state && state.consumedPoints >= settings[name].points) throw tooMany(state.msBeforeNext);
  }

  /** A failure spends a point; reaching the limit is not an error here (the next attempt is refused). */
  async function spend(name: RateLimitName, key: string): Promise<void> {
    await limiters[name].penalty(key, 1);
  }

  const guard =
    (check: (req: Request) => Promise<void>): RequestHandler =>
    async (req, _res, next) => {
      await check(req);
      next();
    };

  const ipOf = (req: Request) => req.ip ?? 'unknown';

  const guards: Record<RouteRateLimit, RequestHandler> = {
    signIn: guard(async (req) => {
      await assertRoom('signInFailuresPerIp', ipOf(req));
      const email = emailOf(req);
      if (email) await assertRoom('signInFailuresPerAccount', email);
      await consume('passwordHashes', 'all');
    }),
    passwordReset: guard(async (req) => {
      await consume('resetRequestsPerIp', ipOf(req));
      const email = emailOf(req);
      if (email) await consume('resetRequestsPerAddress', email);
    }),
    passwordResetCompletion: guard(async (req) => {
      await consume('resetCompletionsPerIp', ipOf(req));
      await consume('passwordHashes', 'all');
    }),
    invitation: guard(async (req) => {
      await consume('invitationsPerAdmin', req.user?.id ?? ipOf(req));
    }),
    twoFactor: guard(async (req) => {
      await assertRoom('signInFailuresPerIp', ipOf(req));
    }),
  };

  return {
    guards,
    consume,
    assertRoom,
    /** A wrong password (or an unknown address) from this client, for this account. */
    async signInFailed(req: Request, account: string | null): Promise<void> {
      await spend('signInFailuresPerIp', ipOf(req));
      if (account) await spend('signInFailuresPerAccount', accountKey(account));
    },
    /** The right password: the account's failure count starts again (the address's does not). */
    async signInSucceeded(account: string): Promise<void> {
      await limiters.signInFailuresPerAccount.delete(accountKey(account));
    },
    spend,
    ipOf,
  };
}

export type RateLimits = ReturnType<typeof createRateLimits>;

/** Adds Retry-After to a 429 from these limits (called by the error middleware). */
export function setRetryAfter(error: unknown, res: Response): void {
  const seconds = (error as { retryAfterSeconds?: number } | null)?.retryAfterSeconds;
  if (seconds) res.setHeader('Retry-After', String(seconds));
}
