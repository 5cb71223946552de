import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

/** SESSION_SECRET when given; otherwise one generated once and kept (owner-only) in the data folder. */
export function resolveSessionSecret(configured: string | undefined, dataDir: string): string {
  if (configured) return configured;
  fs.mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  const file = path.join(dataDir, 'session-secret');
  if (!fs.existsSync(file)) fs.writeFileSync(file, crypto.randomBytes(48).toString('base64url'), { mode: 0o600 });
  return fs.readFileSync(file, 'utf8').trim();
}
