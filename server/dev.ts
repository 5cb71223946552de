import { spawn } from 'node:child_process';
import type { ChildProcess } from 'node:child_process';
import { loadConfig } from './config/env';
import { startEmbeddedPostgres } from './db/embedded-postgres';

/**
 * `npm run dev`: one built-in PostgreSQL for the whole session (unless DATABASE_URL is set),
 * the API in watch mode and Vite with hot reload. Ctrl-C stops both, then the database, so
 * restarts of the API on every code change never restart PostgreSQL.
 */
const config = loadConfig();
const log = (line: string) => console.log(`[dev] ${line}`);
const database = config.DATABASE_URL
  ? undefined
  : await startEmbeddedPostgres({ dataRoot: config.HALFLIGHT_DATA_DIR, port: config.HALFLIGHT_PG_PORT, log });

const env = {
  ...process.env,
  ...(database ? { DATABASE_URL: database.url, HALFLIGHT_DEMO_DATA: process.env.HALFLIGHT_DEMO_DATA ?? 'true' } : {}),
  HALFLIGHT_PUBLIC_URL: process.env.HALFLIGHT_PUBLIC_URL ?? 'http://127.0.0.1:5173',
  // One API process restarts fastest on each change; several web workers are for production.
  HALFLIGHT_WORKERS: process.env.HALFLIGHT_WORKERS ?? '1',
};
const children: ChildProcess[] = [
  spawn('npx', ['tsx', 'watch', '--clear-screen=false', 'server/index.ts'], { stdio: 'inherit', env }),
  spawn('npx', ['vite'], { stdio: 'inherit', env }),
];
log(
  'API on http://127.0.0.1:' +
    config.PORT +
    ', app with hot reload on http://127.0.0.1:5173 — Ctrl-C stops everything.',
);

let stopping = false;
async function stop(code: number) {
  if (stopping) return;
  stopping = true;
  for (const child of children) if (child.exitCode === null) child.kill('SIGTERM');
  await Promise.all(
    children.map((child) =>
      child.exitCode !== null ? Promise.resolve() : new Promise((resolve) => child.once('exit', resolve)),
    ),
  );
  if (database) {
    log('Stopping the embedded PostgreSQL cluster ...');
    await database.stop();
  }
  process.exit(code);
}
process.on('SIGINT', () => void stop(0));
process.on('SIGTERM', () => void stop(0));
for (const child of children) child.once('exit', (code) => void stop(code ?? 0));
