import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { storeUnavailable } from './raw-file-store';

export interface S3Settings {
  bucket: string;
  /** an S3-compatible service's address (MinIO, Ceph, a cloud's S3 API); unset for AWS itself */
  endpoint?: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** bucket in the path (http://host/bucket/key), as most S3-compatible services want */
  forcePathStyle: boolean;
  /** prepended to every key, e.g. "halflight/" */
  prefix: string;
}

/** The three object operations the file store needs, with the SDK's failures turned into 503. */
export interface S3Objects {
  put(key: string, bytes: Buffer): Promise<void>;
  get(key: string): Promise<Buffer>;
  remove(key: string): Promise<void>;
  close(): void;
}

/**
 * Objects in one bucket through @aws-sdk/client-s3. Credentials come from the settings or,
 * when those are unset, from the SDK's usual chain (AWS_* variables, instance roles). Requests
 * give up after a few seconds and two attempts, so a store that is down answers 503 quickly.
 */
export function createS3Objects(settings: S3Settings): S3Objects {
  const client = new S3Client({
    region: settings.region,
    endpoint: settings.endpoint,
    forcePathStyle: settings.forcePathStyle,
    maxAttempts: 2,
    // Checksums only where S3 requires them: several S3-compatible services refuse the newer default headers.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    requestHandler: { connectionTimeout: 3_000, requestTimeout: 30_000 },
    credentials:
      settings.accessKeyId && settings.secretAccessKey
        ? { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey }
        : undefined,
  });
  const Bucket = settings.bucket;
  const Key = (key: string) => `${settings.prefix}${key}`;
  const failed = (what: string) => (error: unknown) => {
    throw storeUnavailable(`${what}: ${(error as Error).name || 'error'}`);
  };
  return {
    async put(key, bytes) {
      await client
        .send(new PutObjectCommand({ Bucket, Key: Key(key), Body: bytes, ContentLength: bytes.length }))
        .catch(failed('storing the file'));
    },
    async get(key) {
      const answer = await client
        .send(new GetObjectCommand({ Bucket, Key: Key(key) }))
        .catch(failed('reading the file'));
      if (!answer.Body) throw storeUnavailable('reading the file: no content');
      return Buffer.from(await answer.Body.transformToByteArray());
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: Key(key) })).catch(failed('removing the file'));
    },
    close: () => client.destroy(),
  };
}
