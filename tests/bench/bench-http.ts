import crypto from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import type { Sequelize } from 'sequelize';
import { createApp } from '../../server/app';
import type { CreateAppOptions } from '../../server/app';
import { hashPassword } from '../../server/auth/passwords';
import { startMailCatcher } from '../../server/mail/catcher';
import { createMailer } from '../../server/mail/mailer';
import { Membership, User } from '../../server/models';

/**
 * The real application listening on 127.0.0.1 (free port) for benchmarks, and a signed-in
 * client that keeps cookies and the CSRF token the way the browser app does
 * (tests/support/accounts.ts does the same through supertest).
 */
export async function startBenchServer(
  sequelize: Sequelize,
  databaseUrl: string,
  overrides: Partial<CreateAppOptions> = {},
) {
  const catcher = await startMailCatcher();
  const mailer = createMailer(catcher.url, 'Halflight bench <bench@halflight.invalid>');
  const app = createApp({
    sequelize,
    embeddedDatabase: true,
    logger: pino({ level: 'silent' }),
    databaseUrl,
    sessionSecret: crypto.randomBytes(32).toString('hex'),
    mailer,
    mailCatcher: true,
    publicUrl: 'http://127.0.0.1:4310',
    ...overrides,
  });
  await app.startJobs();
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve, reject) => server.once('listening', resolve).once('error', reject));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    baseUrl,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await app.closeResources();
      mailer.close();
      await catcher.stop();
    },
  };
}

/** A new member of the lab with the given role (bench account, invented). */
export async function createBenchMember(labId: string, role: 'viewer' | 'researcher') {
  const password = crypto.randomBytes(12).toString('hex');
  const user = await User.create({
    email: `bench-${role}-${crypto.randomBytes(3).toString('hex')}@example.invalid`,
    name: `Bench ${role}`,
    passwordHash: await hashPassword(password),
  });
  await Membership.create({ labId, userId: user.id, role });
  return { email: user.email, password };
}

/**
 * fetch with a cookie jar and the CSRF token; signs in through POST /api/session (or stays
 * signed out when `account` is null).
 */
export async function signedInClient(baseUrl: string, account: { email: string; password: string } | null) {
  const cookies = new Map<string, string>();
  let csrfToken = '';
  const call = async (method: string, url: string, body?: object) => {
    const response = await fetch(`${baseUrl}${url}`, {
      method,
      headers: {
        cookie: [...cookies].map(([name, value]) => `${name}=${value}`).join('; '),
        ...(method === 'GET' ? {} : { 'x-csrf-token': csrfToken, 'content-type': 'application/json' }),
      },
      body: body ? JSON.stringify(body) : undefined,
    });
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const at = pair!.indexOf('=');
      cookies.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
    return response;
  };
  csrfToken = ((await (await call('GET', '/api/csrf-token')).json()) as { csrfToken: string }).csrfToken;
  if (account) {
    const session = await call('POST', '/api/session', account);
    if (session.status !== 200) throw new Error(`bench sign-in failed: ${session.status} ${await session.text()}`);
    csrfToken = ((await session.json()) as { csrfToken: string }).csrfToken;
  }
  return {
    get: (url: string) => call('GET', url),
    post: async (url: string, body: object) => {
      const response = await call('POST', url, body);
      await response.arrayBuffer();
      return response;
    },
  };
}
