import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';
import type { S3Settings } from '../../server/services/studies/files/s3-objects';
import { freePort } from './free-port';

/**
 * A local S3 fake (s3rver) on a free loopback port with one empty bucket, its objects in a
 * temporary folder; `settings` point the app's S3 client at it.
 */
export async function startFakeS3() {
  const directory = fs.mkdtempSync(path.join(os.tmpdir(), 'halflight-s3-'));
  const port = await freePort();
  const bucket = 'halflight-test';
  const server = new S3rver({
    port,
    address: '127.0.0.1',
    silent: true,
    directory,
    configureBuckets: [{ name: bucket }],
  });
  await server.run();
  const settings: S3Settings = {
    bucket,
    endpoint: `http://127.0.0.1:${port}`,
    region: 'us-east-1',
    // s3rver's fixed test credentials (its README)
    accessKeyId: 'S3RVER',
    secretAccessKey: 'S3RVER',
    forcePathStyle: true,
    prefix: 'tests/',
  };
  return {
    settings,
    async stop() {
      await server.close();
      fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}
