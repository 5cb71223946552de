import type { AppConfig } from '../../../config/env';
import { createRawFileStore, type RawFileStore } from './raw-file-store';
import { createS3Objects, type S3Objects, type S3Settings } from './s3-objects';

/** The object-storage settings from the environment, or null when no bucket is named. */
export function s3SettingsOf(config: AppConfig): S3Settings | null {
  if (!config.HALFLIGHT_S3_BUCKET) return null;
  return {
    bucket: config.HALFLIGHT_S3_BUCKET,
    endpoint: config.HALFLIGHT_S3_ENDPOINT,
    region: config.HALFLIGHT_S3_REGION,
    accessKeyId: config.HALFLIGHT_S3_ACCESS_KEY_ID,
    secretAccessKey: config.HALFLIGHT_S3_SECRET_ACCESS_KEY,
    forcePathStyle: config.HALFLIGHT_S3_FORCE_PATH_STYLE ?? config.HALFLIGHT_S3_ENDPOINT !== undefined,
    prefix: config.HALFLIGHT_S3_PREFIX,
  };
}

/**
 * The file store the configuration asks for: new files in the database (default) or in the
 * bucket; files already kept in the bucket stay readable whenever a bucket is configured.
 */
export function fileStoreFromConfig(config: AppConfig): { files: RawFileStore; s3: S3Objects | null } {
  const settings = s3SettingsOf(config);
  const s3 = settings ? createS3Objects(settings) : null;
  return { files: createRawFileStore({ writeTo: config.HALFLIGHT_FILE_STORE, s3 }), s3 };
}
