import type { Readable } from 'node:stream';

// Where clip files and frames live, behind keys like
// `teams/<teamId>/clips/<clipId>/v-<version>/frames/000123.jpg`: local disk
// (local-disk.ts, the default) or an S3-compatible object store (s3.ts).

export interface StoredObject {
  key: string;
  sizeBytes: number;
  modifiedAt: Date;
}

export interface Storage {
  /** Stores a stream under the key (replacing any object there). */
  put(key: string, body: Readable): Promise<StoredObject>;
  /** Moves a local file into storage; cheap (a rename) on local disk. */
  putFile(key: string, localPath: string): Promise<StoredObject>;
  /**
   * Moves every file of a local folder (flat) under the prefix (ending in '/');
   * one rename on local disk. Returns the stored objects.
   */
  putDirectory(prefix: string, localDir: string): Promise<StoredObject[]>;
  get(key: string): Promise<Readable>;
  /** Null when absent. */
  stat(key: string): Promise<StoredObject | null>;
  delete(key: string): Promise<void>;
  /** Deletes every object whose key starts with the prefix. */
  deletePrefix(prefix: string): Promise<void>;
  list(prefix: string): Promise<string[]>;
  /**
   * The object's file on local disk. Only the local-disk driver has one; code
   * that must also run on an object store uses mediaInput, localCopy or readAll.
   */
  localPath(key: string): Promise<string>;
  /**
   * Something ffmpeg/ffprobe can open with seeking: the file itself on local
   * disk, a short-lived presigned HTTP URL (range requests) on an object store.
   */
  mediaInput(key: string): Promise<string>;
  /**
   * A local file with the object's bytes for as long as the caller needs it:
   * the stored file itself on local disk (release does nothing), a download
   * into `scratchDir` on an object store (release deletes it).
   */
  localCopy(key: string, scratchDir: string): Promise<{ path: string; release: () => Promise<void> }>;
  /** A scratch folder for extraction: on local disk beside the objects (cheap renames); a worker's own folder otherwise. */
  readonly tempDir: string;
  /** 'local' or 's3', for logs and docs. */
  readonly kind: 'local' | 's3';
}

/** The whole object in memory (small objects only: a frame, a JSON file). */
export async function readAll(storage: Storage, key: string): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of await storage.get(key)) chunks.push(Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk));
  return Buffer.concat(chunks);
}

/**
 * Thrown (or recognised) when the store cannot be reached or answers with a
 * server error: the API says 503, a job waits and retries.
 */
export class StorageUnavailableError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'StorageUnavailableError';
  }
}

const NETWORK_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'ENOTFOUND', 'EAI_AGAIN', 'EHOSTUNREACH', 'ENETUNREACH', 'ECONNABORTED', 'UND_ERR_SOCKET']);

/** True for errors that mean "the store is down or unreachable", not "this object is wrong". */
export function isStorageUnavailable(err: unknown): boolean {
  for (let e = err as { name?: string; code?: string; cause?: unknown; $metadata?: { httpStatusCode?: number } } | undefined, depth = 0; e && depth < 5; e = e.cause as typeof e, depth++) {
    if (e instanceof StorageUnavailableError) return true;
    if (e.code && NETWORK_CODES.has(e.code)) return true;
    if (e.name === 'TimeoutError' || e.name === 'RequestTimeout' || e.name === 'ServiceUnavailable' || e.name === 'SlowDown') return true;
    const status = e.$metadata?.httpStatusCode;
    if (status !== undefined && status >= 500) return true;
  }
  return false;
}

const KEY = /^[A-Za-z0-9][A-Za-z0-9._\-/]*$/;

/** Keys are plain relative paths: no `..`, no leading slash, no empty parts. */
export function assertKey(key: string): void {
  if (!KEY.test(key) || key.split('/').some((part) => part === '' || part === '.' || part === '..')) {
    throw new Error(`invalid storage key: ${key}`);
  }
}

export function clipPrefix(teamId: string, clipId: string): string {
  return `teams/${teamId}/clips/${clipId}/`;
}
