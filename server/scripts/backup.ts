import { loadConfig } from '../config/env';
import { createBackup } from '../db/backup';

/**
 * `npm run backup [FOLDER]`: a dated backup file of the built-in or configured database and the
 * session secret, in FOLDER or HALFLIGHT_DATA_DIR/backups. Works while Halflight runs.
 */
const began = performance.now();
try {
  const { file, bytes, manifest } = await createBackup(loadConfig(), {
    outDir: process.argv[2],
    log: (line) => process.stderr.write(`${line}\n`),
  });
  const { studies, uploads, audit } = manifest.counts;
  process.stdout.write(
    `Backup written: ${file}\n` +
      `  ${(bytes / 1e6).toFixed(1)} MB in ${((performance.now() - began) / 1000).toFixed(1)} s: ` +
      `${studies} studies, ${uploads} files, ${audit} audit rows, ${manifest.migrations.length} migrations` +
      `${manifest.sessionSecret ? ', the session secret' : ''}.\n` +
      '  It holds every record and the session secret: keep it where only administrators can read it.\n',
  );
} catch (error) {
  process.stderr.write(`Backup failed: ${(error as Error).message}\n`);
  process.exitCode = 1;
}
