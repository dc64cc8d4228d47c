import {
  CreateBucketCommand,
  DeleteObjectCommand,
  ListObjectsV2Command,
  GetObjectCommand,
  HeadBucketCommand,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import type { Readable } from 'node:stream';
import type { Config } from '../config';

/** Files (photos, exports) live in S3-compatible storage so any API instance can serve them. */
export interface ObjectStore {
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<{ body: Readable; contentType: string | undefined; length: number | undefined }>;
  remove(key: string): Promise<void>;
  /** Every key in the bucket (for backups). */
  list(): Promise<string[]>;
  /** Creates the bucket when it does not exist yet (for restores). */
  ensureBucket(): Promise<void>;
  ping(): Promise<void>;
  destroy(): void;
}

export function createObjectStore(config: Config): ObjectStore {
  const client = new S3Client({
    region: config.S3_REGION,
    ...(config.S3_ENDPOINT ? { endpoint: config.S3_ENDPOINT } : {}),
    forcePathStyle: config.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: config.S3_ACCESS_KEY_ID, secretAccessKey: config.S3_SECRET_ACCESS_KEY },
    maxAttempts: 2,
    requestHandler: { connectionTimeout: 2000, requestTimeout: 15000 },
  });
  const Bucket = config.S3_BUCKET;
  return {
    async put(key, body, contentType) {
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType }));
    },
    async get(key) {
      const out = await client.send(new GetObjectCommand({ Bucket, Key: key }));
      return { body: out.Body as Readable, contentType: out.ContentType, length: out.ContentLength };
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
    async list() {
      const keys: string[] = [];
      let ContinuationToken: string | undefined;
      do {
        const page = await client.send(new ListObjectsV2Command({ Bucket, ContinuationToken }));
        for (const o of page.Contents ?? []) if (o.Key) keys.push(o.Key);
        ContinuationToken = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (ContinuationToken);
      return keys;
    },
    async ensureBucket() {
      await client.send(new HeadBucketCommand({ Bucket })).catch(() => client.send(new CreateBucketCommand({ Bucket })));
    },
    async ping() {
      await client.send(new HeadBucketCommand({ Bucket }));
    },
    destroy() {
      client.destroy();
    },
  };
}
