import { S3Client, GetObjectCommand, HeadObjectCommand, DeleteObjectCommand } from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import { PassThrough, Readable } from 'node:stream';
import type { Storage } from './storage';

export type S3StorageOptions = {
  endpoint: string;
  region?: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** Local S3-compatible servers want path-style URLs (http://host/bucket/key). */
  forcePathStyle?: boolean;
  /** Multipart part size; parts are the only thing held in memory while uploading. */
  partSizeBytes?: number;
};

const KEY = /^[a-z0-9][a-z0-9/_.-]{0,200}$/;

/**
 * The same Storage interface on S3-compatible object storage (the second driver of the storage seam,
 * docs/decisions/007-growing-past-one-machine.md). Uploads stream as multipart parts, so a stem is never
 * whole in memory; an aborted upload is aborted on the server, so nothing partial becomes an object.
 */
export function createS3Storage(opts: S3StorageOptions): Storage {
  const client = new S3Client({
    endpoint: opts.endpoint,
    region: opts.region ?? 'us-east-1',
    forcePathStyle: opts.forcePathStyle ?? true,
    credentials: { accessKeyId: opts.accessKeyId, secretAccessKey: opts.secretAccessKey },
  });
  const check = (key: string) => {
    if (!KEY.test(key) || key.includes('..')) throw new Error(`invalid storage key: ${key}`);
    return key;
  };
  return {
    async put(key, body) {
      const upload = new Upload({
        client,
        params: { Bucket: opts.bucket, Key: check(key), Body: body },
        partSize: opts.partSizeBytes ?? 8 * 1024 * 1024,
        queueSize: 2,
        leavePartsOnError: false,
      });
      await upload.done();
      const head = await client.send(new HeadObjectCommand({ Bucket: opts.bucket, Key: key }));
      return { size: Number(head.ContentLength ?? 0) };
    },
    get(key, range) {
      // The interface returns a stream synchronously (like fs.createReadStream); the request starts at once.
      const out = new PassThrough();
      client
        .send(
          new GetObjectCommand({
            Bucket: opts.bucket,
            Key: check(key),
            Range: range ? `bytes=${range.start}-${range.end}` : undefined,
          }),
        )
        .then((res) => (res.Body as Readable).pipe(out))
        .catch((err) => out.destroy(err));
      return out;
    },
    async stat(key) {
      try {
        const head = await client.send(new HeadObjectCommand({ Bucket: opts.bucket, Key: check(key) }));
        return { size: Number(head.ContentLength ?? 0) };
      } catch (err) {
        if ((err as { name?: string }).name === 'NotFound' || (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null;
        throw err;
      }
    },
    async delete(key) {
      await client.send(new DeleteObjectCommand({ Bucket: opts.bucket, Key: check(key) }));
    },
    localPath() {
      return null;
    },
  };
}
