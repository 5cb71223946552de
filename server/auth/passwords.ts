import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import { AppError } from '../lib/app-error';

/**
 * Password hashing with scrypt on libuv's thread pool, so a flood of sign-ins does not stall the
 * event loop. Parameters: N = 2^16, r = 8, p = 1 (64 MiB per hash): half the work of the OWASP
 * Password Storage Cheat Sheet's scrypt setting (N = 2^17), about as long per check as the
 * bcrypt cost 12 it replaces; the settings are stored with each hash, so raising them later
 * rehashes at the next sign-in. scrypt reads the whole password: nothing is truncated (bcrypt
 * ignored everything past 72 bytes).
 *
 * Stored as `scrypt$<log2 N>$<r>$<p>$<salt base64>$<key base64>`. Hashes made earlier with bcrypt
 * ($2a$/$2b$) still verify, and `needsRehash` tells the sign-in to store a scrypt hash instead.
 */
const cost = { log2N: 16, r: 8, p: 1 };
const keyLength = 32;
const maxmem = 96 * 1024 * 1024;

// At most two hashes at once per process (the pool has four threads; file and zlib work needs the
// rest); more wait in line, and past a short line the request is turned away at once.
const maxConcurrent = 2;
const maxWaiting = 64;
let running = 0;
const waiting: Array<() => void> = [];

async function withHashSlot<T>(work: () => Promise<T>): Promise<T> {
  if (running >= maxConcurrent) {
    if (waiting.length >= maxWaiting) {
      throw new AppError('busy', 'Halflight is checking many passwords right now. Try again in a few seconds.', 503);
    }
    await new Promise<void>((resolve) => waiting.push(resolve));
  }
  running += 1;
  try {
    return await work();
  } finally {
    running -= 1;
    waiting.shift()?.();
  }
}

function scrypt(password: string, salt: Buffer, params: typeof cost): Promise<Buffer> {
  return withHashSlot(
    () =>
      new Promise((resolve, reject) =>
        crypto.scrypt(
          password.normalize('NFC'),
          salt,
          keyLength,
          { N: 2 ** params.log2N, r: params.r, p: params.p, maxmem },
          (error, key) => (error ? reject(error) : resolve(key)),
        ),
      ),
  );
}

export async function hashPassword(password: string): Promise<string> {
  const salt = crypto.randomBytes(16);
  const key = await scrypt(password, salt, cost);
  return ['scrypt', cost.log2N, cost.r, cost.p, salt.toString('base64'), key.toString('base64')].join('$');
}

function parseScrypt(hash: string) {
  const [scheme, log2N, r, p, salt, key] = hash.split('$');
  if (scheme !== 'scrypt' || !salt || !key) return null;
  return { params: { log2N: Number(log2N), r: Number(r), p: Number(p) }, salt: Buffer.from(salt, 'base64'), key };
}

// Checked when the e-mail is unknown, so a wrong address costs as long as a wrong password.
let decoyHash: Promise<string> | undefined;

export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  decoyHash ??= hashPassword('halflight-decoy-password');
  const stored = hash ?? (await decoyHash);
  const scryptHash = parseScrypt(stored);
  let matches: boolean;
  if (scryptHash) {
    const key = await scrypt(password, scryptHash.salt, scryptHash.params);
    const expected = Buffer.from(scryptHash.key, 'base64');
    matches = key.length === expected.length && crypto.timingSafeEqual(key, expected);
  } else {
    matches = await bcrypt.compare(password, stored);
  }
  return hash ? matches : false;
}

/** True for a bcrypt hash or older scrypt settings: store a new hash at the next sign-in. */
export function needsRehash(hash: string): boolean {
  const parsed = parseScrypt(hash);
  return !parsed || parsed.params.log2N !== cost.log2N || parsed.params.r !== cost.r || parsed.params.p !== cost.p;
}
