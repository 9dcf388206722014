import { randomBytes } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  CreateBucketCommand,
  DeleteBucketCommand,
  DeleteObjectCommand,
  ListObjectsV2Command,
  S3Client,
} from '@aws-sdk/client-s3';

type StartFakes = (options: { mailDir: string; s3Dir: string; smtpPort: number; s3Port: number; bucket: string }) => Promise<{
  s3Endpoint: string;
  close(): Promise<void>;
}>;

export interface TestObjectStore {
  /** Env for `startTestApp({ env })`: endpoint and this file's own bucket. */
  env: Record<string, string>;
  bucket: string;
  /** Every key in the bucket under a prefix. */
  listKeys(prefix?: string): Promise<string[]>;
  close(): Promise<void>;
}

function client(endpoint: string): S3Client {
  return new S3Client({
    endpoint,
    region: 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
}

/**
 * An S3 bucket of this test file's own, so that listings see only its objects even while other
 * files run in parallel: a new bucket on the object-store fake `npm test` started (S3_ENDPOINT,
 * named after S3_BUCKET), or, when run without it, a fake of its own on a free port.
 */
export async function startTestObjectStore(): Promise<TestObjectStore> {
  const base = process.env.S3_BUCKET ?? 'plummet-photos';
  const bucket = `${base}-${randomBytes(4).toString('hex')}`;
  let endpoint = process.env.S3_ENDPOINT;
  let stopFakes: (() => Promise<void>) | undefined;
  let dir: string | undefined;
  if (!endpoint) {
    dir = mkdtempSync(join(tmpdir(), 'plummet-s3-'));
    const fakesUrl = new URL('../../scripts/lib/fakes.mjs', import.meta.url).href;
    const { startFakes } = (await import(fakesUrl)) as { startFakes: StartFakes };
    const fakes = await startFakes({ mailDir: join(dir, 'mail'), s3Dir: join(dir, 's3'), smtpPort: 0, s3Port: 0, bucket });
    endpoint = fakes.s3Endpoint;
    stopFakes = () => fakes.close();
  }
  const s3 = client(endpoint);
  if (!stopFakes) await s3.send(new CreateBucketCommand({ Bucket: bucket }));

  async function listKeys(prefix = ''): Promise<string[]> {
    const keys: string[] = [];
    let token: string | undefined;
    do {
      const page = await s3.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix, ContinuationToken: token }));
      for (const o of page.Contents ?? []) if (o.Key) keys.push(o.Key);
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
    return keys.sort();
  }

  return {
    env: { S3_ENDPOINT: endpoint, S3_BUCKET: bucket, S3_FORCE_PATH_STYLE: 'true' },
    bucket,
    listKeys,
    async close() {
      if (stopFakes) {
        await stopFakes();
        if (dir) rmSync(dir, { recursive: true, force: true });
      } else {
        for (const key of await listKeys()) await s3.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
        await s3.send(new DeleteBucketCommand({ Bucket: bucket }));
      }
      s3.destroy();
    },
  };
}
