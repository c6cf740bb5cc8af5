import type { Readable } from 'node:stream';

// Where clip files and frames live, behind keys like
// `teams/<teamId>/clips/<clipId>/frames-<version>/000123.jpg`. Local disk now;
// an object store later implements the same interface.

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
   * A local path to read the object from (ffmpeg needs a seekable file). Local
   * disk returns the file itself; an object store would download to a temp file.
   */
  localPath(key: string): Promise<string>;
  /** A scratch folder for uploads and extraction, on the same file system as the objects. */
  readonly tempDir: string;
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
