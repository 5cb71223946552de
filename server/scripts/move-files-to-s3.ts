/**
 * `npm run files:move-to-s3`: moves every raw upload, decay file and mechanism file kept in PostgreSQL into the configured
 * S3-compatible bucket (HALFLIGHT_S3_* variables), checking each file's SHA-256 before and
 * after. Run it with Halflight stopped when it uses its built-in database (the cluster's folder
 * is locked while the app runs), or at any time against DATABASE_URL. Then set
 * HALFLIGHT_FILE_STORE=s3 so new files go to the bucket too.
 */
import { loadConfig } from '../config/env';
import { startEmbeddedPostgres, type EmbeddedPostgres } from '../db/embedded-postgres';
import { migrateToLatest } from '../db/migrator';
import { createSequelize } from '../db/sequelize';
import { initModels } from '../models';
import { s3SettingsOf } from '../services/studies/files/file-store-config';
import { moveFilesToS3 } from '../services/studies/files/move-files-to-s3';
import { createS3Objects } from '../services/studies/files/s3-objects';

const print = (line: string) => process.stdout.write(`${line}\n`);

async function main() {
  const config = loadConfig();
  const settings = s3SettingsOf(config);
  if (!settings) throw new Error('Set HALFLIGHT_S3_BUCKET (and the other HALFLIGHT_S3_* variables) first.');
  let database: EmbeddedPostgres | undefined;
  if (!config.DATABASE_URL)
    database = await startEmbeddedPostgres({ dataRoot: config.HALFLIGHT_DATA_DIR, port: config.HALFLIGHT_PG_PORT });
  const sequelize = createSequelize(config.DATABASE_URL ?? database!.url);
  const s3 = createS3Objects(settings);
  try {
    await migrateToLatest(sequelize);
    initModels(sequelize);
    const { moved, refused } = await moveFilesToS3(s3, print);
    print(`Moved ${moved} file(s) to bucket "${settings.bucket}"; ${refused} left in the database (see above).`);
    if (refused > 0) process.exitCode = 1;
  } finally {
    s3.close();
    await sequelize.close();
    await database?.stop();
  }
}

main().catch((error: Error) => {
  process.stderr.write(`${error.message}\n`);
  process.exitCode = 1;
});
