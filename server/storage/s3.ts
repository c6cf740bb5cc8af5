// Storage on an S3-compatible object store (AWS S3, MinIO, Ceph, the s3rver
// fake in tests), with the official AWS SDK. Streams go up as multipart uploads
// through lib-storage, which holds at most PART_SIZE × QUEUE_SIZE bytes in
// memory and nothing on disk; small files (frames, thumbnails) are single PUTs
// from a buffer, so the SDK can retry them. Keys are the same as on local disk,
// below the bucket prefix of STORAGE_URL.
import { randomBytes } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, readFile, readdir, rm, stat as statFile } from 'node:fs/promises';
import path from 'node:path';
import { Transform, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  DeleteObjectsCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import type { S3Settings } from '../config';
import { StorageUnavailableError, assertKey, isStorageUnavailable, type Storage, type StoredObject } from './storage';

/** Multipart part size: S3's minimum is 5 MiB; 8 MiB keeps an upload's memory at 16 MiB with two parts in flight. */
export const PART_SIZE_BYTES = 8 * 1024 ** 2;
export const QUEUE_SIZE = 2;
/** Parallel PUTs when a folder of frames goes up. */
const PUT_CONCURRENCY = 8;
/** Lifetime of a presigned URL handed to ffprobe/ffmpeg (it only needs the minutes of one probe). */
const PRESIGN_SECONDS = 15 * 60;

export interface S3StorageOptions extends S3Settings {
  /** Where localCopy downloads and extraction scratch go (the worker's own folder). */
  tempDir: string;
}

export function s3Client(s: S3Settings): S3Client {
  return new S3Client({
    region: s.region,
    endpoint: s.endpoint ?? undefined,
    forcePathStyle: s.forcePathStyle,
    credentials: s.credentials ?? undefined,
    // A store that is down should fail a request in seconds, not hang an upload.
    requestHandler: { connectionTimeout: 5_000, requestTimeout: 120_000 },
    maxAttempts: 3,
    ...(s.checksumsWhenRequired ? { requestChecksumCalculation: 'WHEN_REQUIRED', responseChecksumValidation: 'WHEN_REQUIRED' } : {}),
  });
}

const isNotFound = (err: unknown) => {
  const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === 'NotFound' || e?.name === 'NoSuchKey' || e?.$metadata?.httpStatusCode === 404;
};

/** Re-throws store outages as StorageUnavailableError so callers can tell them from bad input. */
function unavailable(err: unknown, what: string): never {
  if (isStorageUnavailable(err)) throw new StorageUnavailableError(`the object store is unreachable (${what}: ${(err as Error).message})`, { cause: err });
  throw err;
}

async function inBatches<T>(items: T[], size: number, fn: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  const lanes = Array.from({ length: Math.min(size, items.length) }, async () => {
    while (next < items.length) await fn(items[next++]);
  });
  await Promise.all(lanes);
}

export function s3Storage(options: S3StorageOptions, client: S3Client = s3Client(options)): Storage & { client: S3Client; bucket: string; prefix: string } {
  const { bucket, prefix } = options;
  const full = (key: string) => {
    assertKey(key);
    return `${prefix}${key}`;
  };

  async function putBuffer(key: string, body: Buffer): Promise<StoredObject> {
    await client.send(new PutObjectCommand({ Bucket: bucket, Key: full(key), Body: body, ContentLength: body.length })).catch((err) => unavailable(err, `PUT ${key}`));
    return { key, sizeBytes: body.length, modifiedAt: new Date() };
  }

  async function listFull(keyPrefix: string): Promise<string[]> {
    const out: string[] = [];
    let token: string | undefined;
    do {
      const page = await client
        .send(new ListObjectsV2Command({ Bucket: bucket, Prefix: `${prefix}${keyPrefix}`, ContinuationToken: token }))
        .catch((err) => unavailable(err, `LIST ${keyPrefix}`));
      for (const o of page.Contents ?? []) if (o.Key) out.push(o.Key.slice(prefix.length));
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
    return out.sort();
  }

  const storage = {
    kind: 's3' as const,
    tempDir: options.tempDir,
    client,
    bucket,
    prefix,
    async put(key: string, body: Readable): Promise<StoredObject> {
      let size = 0;
      const count = new Transform({
        transform(chunk: Buffer, _enc, done) {
          size += chunk.length;
          done(null, chunk);
        },
      });
      // A failing source must fail the upload (lib-storage then aborts the multipart upload).
      body.once('error', (err) => count.destroy(err));
      const upload = new Upload({
        client,
        params: { Bucket: bucket, Key: full(key), Body: body.pipe(count) },
        partSize: PART_SIZE_BYTES,
        queueSize: QUEUE_SIZE,
        leavePartsOnError: false,
      });
      try {
        await upload.done();
      } catch (err) {
        // lib-storage has aborted the multipart upload; a single-part PUT left nothing either.
        unavailable(err, `upload ${key}`);
      }
      return { key, sizeBytes: size, modifiedAt: new Date() };
    },
    async putFile(key: string, localPath: string): Promise<StoredObject> {
      const { size } = await statFile(localPath);
      const stored = size <= PART_SIZE_BYTES ? await putBuffer(key, await readFile(localPath)) : await storage.put(key, createReadStream(localPath));
      await rm(localPath, { force: true });
      return stored;
    },
    async putDirectory(keyPrefix: string, localDir: string): Promise<StoredObject[]> {
      if (!keyPrefix.endsWith('/')) throw new Error(`putDirectory needs a prefix ending in '/': ${keyPrefix}`);
      const names = (await readdir(localDir)).sort();
      const stored: StoredObject[] = [];
      await inBatches(names, PUT_CONCURRENCY, async (name) => {
        stored.push(await putBuffer(`${keyPrefix}${name}`, await readFile(path.join(localDir, name))));
      });
      await rm(localDir, { recursive: true, force: true });
      return stored.sort((a, b) => (a.key < b.key ? -1 : 1));
    },
    async get(key: string): Promise<Readable> {
      try {
        const res = await client.send(new GetObjectCommand({ Bucket: bucket, Key: full(key) }));
        return res.Body as Readable;
      } catch (err) {
        if (isNotFound(err)) throw Object.assign(new Error(`no object ${key}`), { code: 'ENOENT' });
        unavailable(err, `GET ${key}`);
      }
    },
    async stat(key: string): Promise<StoredObject | null> {
      try {
        const head = await client.send(new HeadObjectCommand({ Bucket: bucket, Key: full(key) }));
        return { key, sizeBytes: head.ContentLength ?? 0, modifiedAt: head.LastModified ?? new Date(0) };
      } catch (err) {
        if (isNotFound(err)) return null;
        unavailable(err, `HEAD ${key}`);
      }
    },
    async delete(key: string): Promise<void> {
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: full(key) })).catch((err) => unavailable(err, `DELETE ${key}`));
    },
    async deletePrefix(keyPrefix: string): Promise<void> {
      const keys = await listFull(keyPrefix);
      for (let i = 0; i < keys.length; i += 1000) {
        const batch = keys.slice(i, i + 1000);
        await client
          .send(new DeleteObjectsCommand({ Bucket: bucket, Delete: { Objects: batch.map((k) => ({ Key: `${prefix}${k}` })), Quiet: true } }))
          .catch((err) => unavailable(err, `DELETE ${keyPrefix}*`));
      }
    },
    list: listFull,
    async localPath(key: string): Promise<string> {
      throw new Error(`${key} is in an object store and has no local path; use mediaInput, localCopy or readAll`);
    },
    async mediaInput(key: string): Promise<string> {
      return getSignedUrl(client, new GetObjectCommand({ Bucket: bucket, Key: full(key) }), { expiresIn: PRESIGN_SECONDS });
    },
    async localCopy(key: string, scratchDir: string) {
      await mkdir(scratchDir, { recursive: true });
      const file = path.join(scratchDir, `copy-${randomBytes(6).toString('hex')}-${path.basename(key)}`);
      try {
        await pipeline(await storage.get(key), createWriteStream(file));
      } catch (err) {
        await rm(file, { force: true });
        unavailable(err, `download ${key}`);
      }
      return { path: file, release: () => rm(file, { force: true }) };
    },
  };
  return storage;
}

/** For the local fake and first-time set-ups: creates the bucket unless it exists. */
export async function ensureBucket(client: S3Client, bucket: string): Promise<void> {
  try {
    await client.send(new CreateBucketCommand({ Bucket: bucket }));
  } catch (err) {
    const name = (err as { name?: string }).name;
    if (name !== 'BucketAlreadyOwnedByYou' && name !== 'BucketAlreadyExists') throw err;
  }
}
