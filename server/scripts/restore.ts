import { loadConfig } from '../config/env';
import { restoreBackup } from '../db/backup';

/**
 * `npm run restore FILE`: a backup made by `npm run backup` into an empty database (the built-in
 * cluster of HALFLIGHT_DATA_DIR, made when missing, or DATABASE_URL). Halflight must be stopped.
 */
const file = process.argv[2];
if (!file) {
  process.stderr.write('Usage: npm run restore FILE (a file made by npm run backup)\n');
  process.exit(2);
}
const began = performance.now();
try {
  const manifest = await restoreBackup(loadConfig(), file, { log: (line) => process.stderr.write(`${line}\n`) });
  const { studies, uploads, audit } = manifest.counts;
  process.stdout.write(
    `Restored ${file} (made ${manifest.createdAt} by Halflight ${manifest.appVersion}) in ` +
      `${((performance.now() - began) / 1000).toFixed(1)} s: ${studies} studies, ${uploads} files, ${audit} audit rows.\n` +
      '  Start Halflight as usual (npm start); it applies any newer migrations.\n',
  );
} catch (error) {
  process.stderr.write(`Restore failed: ${(error as Error).message}\n`);
  process.exitCode = 1;
}
