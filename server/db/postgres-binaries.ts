import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const debianRoot = '/usr/lib/postgresql';
export const installCommand = 'sudo apt-get update && sudo apt-get install -y postgresql';

export const isRoot = (): boolean => typeof process.getuid === 'function' && process.getuid() === 0;

/** The newest Debian PostgreSQL server binaries folder, e.g. /usr/lib/postgresql/15/bin. */
function findBinDir(): string | null {
  if (!fs.existsSync(debianRoot)) return null;
  const versions = fs
    .readdirSync(debianRoot)
    .filter((name) => /^\d+$/.test(name) && fs.existsSync(path.join(debianRoot, name, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length > 0 ? path.join(debianRoot, versions[0]!, 'bin') : null;
}

/**
 * Locates PostgreSQL's server binaries, installing Debian's package when we are root and they
 * are missing. Without root it stops with the exact command to run.
 */
export function ensurePostgresBinaries(log: (line: string) => void): string {
  const found = findBinDir();
  if (found) return found;
  if (!isRoot()) {
    throw new Error(
      `PostgreSQL server binaries were not found in ${debianRoot}.\n` +
        `Install them with:\n  ${installCommand}\n` +
        'or set DATABASE_URL to use a PostgreSQL server you already run.',
    );
  }
  log('PostgreSQL server binaries are missing; installing the Debian "postgresql" package (apt-get)...');
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', 'postgresql'], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  const installed = findBinDir();
  if (!installed) throw new Error(`apt-get finished but no pg_ctl appeared under ${debianRoot}.`);
  return installed;
}

/** uid/gid of the "postgres" system user, which runs the server when we are root. */
export function postgresUser(): { uid: number; gid: number } {
  const result = spawnSync('id', ['-u', 'postgres'], { encoding: 'utf8' });
  const gidResult = spawnSync('id', ['-g', 'postgres'], { encoding: 'utf8' });
  if (result.status !== 0 || gidResult.status !== 0) {
    throw new Error(
      'Running as root, PostgreSQL must run as the "postgres" user, which does not exist here. ' +
        `Install the Debian package, which creates it:\n  ${installCommand}`,
    );
  }
  return { uid: Number(result.stdout.trim()), gid: Number(gidResult.stdout.trim()) };
}
