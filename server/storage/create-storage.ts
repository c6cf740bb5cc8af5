// The one place that turns config into a Storage: local disk unless
// STORAGE_URL names an S3 bucket. Server, worker, seed and tests all come here.
import os from 'node:os';
import path from 'node:path';
import type { Config } from '../config';
import { localDiskStorage } from './local-disk';
import { s3Storage } from './s3';
import type { Storage } from './storage';

/**
 * @param scratchDir where an object store's downloads and extraction scratch go
 *   (a worker's own folder); local disk always uses `<storageDir>/tmp`.
 */
export function createStorage(config: Config, scratchDir?: string): Storage {
  if (config.storage.kind === 'local') return localDiskStorage(config.storageDir);
  return s3Storage({ ...config.storage, tempDir: scratchDir ?? config.scratchDir ?? defaultScratchDir() });
}

/** A per-process scratch folder in the OS temp dir (see scratch.ts for sweeping). */
export function defaultScratchDir(pid = process.pid): string {
  return path.join(os.tmpdir(), `arcbench-scratch-${pid}`);
}

/** Where a storage's objects are, for logs: the folder or s3://bucket/prefix. */
export function describeStorage(config: Config): string {
  return config.storage.kind === 'local' ? config.storageDir : `s3://${config.storage.bucket}/${config.storage.prefix}${config.storage.endpoint ? ` at ${config.storage.endpoint}` : ''}`;
}
