import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';

/** The folder holding package.json: found upwards, so it is the same from server/ and dist/server/. */
function findProjectRoot(start: string): string {
  for (let dir = start; ; dir = path.dirname(dir)) {
    if (fs.existsSync(path.join(dir, 'package.json'))) return dir;
    if (dir === path.dirname(dir)) throw new Error(`No package.json above ${start}.`);
  }
}

export const projectRoot = findProjectRoot(path.dirname(fileURLToPath(import.meta.url)));

const booleanFlag = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((value) => value === 'true' || value === '1' || value === 'yes');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(4310),
  HOST: z.string().min(1).default('127.0.0.1'),
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, 'must be a postgres:// or postgresql:// URL')
    .optional(),
  SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  SMTP_URL: z
    .string()
    .regex(/^smtps?:\/\//, 'must be an smtp:// or smtps:// URL')
    .optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  HALFLIGHT_DATA_DIR: z.string().min(1).default(path.join(projectRoot, '.halflight')),
  HALFLIGHT_PG_PORT: z.coerce.number().int().min(1024).max(65535).default(55432),
  HALFLIGHT_DEMO_DATA: booleanFlag.optional(),
  HALFLIGHT_BEHIND_TLS: booleanFlag.default(false),
  HALFLIGHT_JOB_WORKER: booleanFlag.default(true),
  HALFLIGHT_TRUST_PROXY: z
    .string()
    .regex(
      /^[0-9a-zA-Z:./,\s]+$/,
      'must be a number of proxy hops (e.g. 1) or a comma-separated list of proxy addresses or subnets',
    )
    .optional(),
  HALFLIGHT_WORKERS: z.coerce.number().int().min(1, 'must be 1 or more').max(64).optional(),
  HALFLIGHT_DB_POOL_READ: z.coerce.number().int().min(1, 'must be 1 or more').max(100).default(8),
  HALFLIGHT_DB_POOL_WRITE: z.coerce.number().int().min(1, 'must be 1 or more').max(100).default(6),
  HALFLIGHT_SESSION_POOL_READ: z.coerce.number().int().min(1, 'must be 1 or more').max(100).default(5),
  HALFLIGHT_SESSION_POOL_WRITE: z.coerce.number().int().min(1, 'must be 1 or more').max(100).default(2),
  HALFLIGHT_READ_CONCURRENCY: z.coerce.number().int().min(1, 'must be 1 or more').max(1000).default(4),
  HALFLIGHT_READ_QUEUE: z.coerce.number().int().min(0, 'must be 0 or more').max(100_000).default(500),
  HALFLIGHT_READ_WHILE_WRITING: z.coerce.number().int().min(1, 'must be 1 or more').max(1000).default(2),
  HALFLIGHT_PUBLIC_URL: z
    .string()
    .regex(/^https?:\/\//, 'must start with http:// or https://')
    .optional(),
  MAIL_FROM: z.string().min(3).default('Halflight <no-reply@halflight.invalid>'),
  HALFLIGHT_FIRST_ADMIN_EMAIL: z.string().email('must be an e-mail address').optional(),
  HALFLIGHT_FIRST_ADMIN_PASSWORD: z.string().min(12, 'must be at least 12 characters').optional(),
  HALFLIGHT_FIRST_LAB_NAME: z.string().min(1).max(160).optional(),
  HALFLIGHT_FILE_STORE: z.enum(['database', 's3']).default('database'),
  HALFLIGHT_S3_BUCKET: z.string().min(3).max(63).optional(),
  HALFLIGHT_S3_ENDPOINT: z.string().url('must be a URL such as https://s3.example.org').optional(),
  HALFLIGHT_S3_REGION: z.string().min(1).default('us-east-1'),
  HALFLIGHT_S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  HALFLIGHT_S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  HALFLIGHT_S3_FORCE_PATH_STYLE: booleanFlag.optional(),
  HALFLIGHT_S3_PREFIX: z.string().default(''),
});

export type AppConfig = z.infer<typeof envSchema> & {
  demoData: boolean;
  publicUrl: string;
  trustProxy: number | string[] | false;
  /** Web processes to run (HALFLIGHT_WORKERS). */
  workers: number;
};

/** HALFLIGHT_TRUST_PROXY: a hop count, or the proxies' addresses and subnets; unset trusts none. */
export function parseTrustProxy(value: string | undefined): number | string[] | false {
  if (value === undefined || value.trim() === '') return false;
  if (/^\d+$/.test(value.trim())) return Number(value.trim());
  return value
    .split(',')
    .map((part) => part.trim())
    .filter(Boolean);
}

/**
 * Reads configuration from environment variables and fails fast, naming each bad variable.
 * Demo data is loaded by default only on the embedded database, never silently into a
 * PostgreSQL the operator pointed us at.
 */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Halflight configuration is invalid:\n${lines.join('\n')}`);
  }
  const config = parsed.data;
  if (config.HALFLIGHT_FILE_STORE === 's3' && !config.HALFLIGHT_S3_BUCKET)
    throw new Error(
      'Halflight configuration is invalid:\n  HALFLIGHT_S3_BUCKET: required when HALFLIGHT_FILE_STORE=s3',
    );
  const trustProxy = parseTrustProxy(config.HALFLIGHT_TRUST_PROXY);
  if (config.HALFLIGHT_BEHIND_TLS && trustProxy === false) {
    throw new Error(
      'Halflight configuration is invalid:\n  HALFLIGHT_TRUST_PROXY: must be set with HALFLIGHT_BEHIND_TLS=true ' +
        "(the proxy's address, e.g. 127.0.0.1, or its hop count, e.g. 1), so client addresses come from that proxy only",
    );
  }
  const shownHost = config.HOST === '0.0.0.0' ? '127.0.0.1' : config.HOST;
  return {
    ...config,
    demoData: config.HALFLIGHT_DEMO_DATA ?? config.DATABASE_URL === undefined,
    trustProxy,
    // One web process per core, at most four (each holds its own database connections).
    workers: config.HALFLIGHT_WORKERS ?? Math.min(os.availableParallelism(), 4),
    publicUrl: (config.HALFLIGHT_PUBLIC_URL ?? `http://${shownHost}:${config.PORT}`).replace(/\/$/, ''),
  };
}
