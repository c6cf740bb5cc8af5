import { describe, expect, it } from 'vitest';
import { loadConfig, parseStorageUrl } from '../config';
import { StorageUnavailableError, assertKey, isStorageUnavailable } from './storage';

describe('STORAGE_URL', () => {
  it('names a bucket and a prefix ending in a slash', () => {
    expect(parseStorageUrl('s3://arcbench-clips/range-a')).toEqual({ bucket: 'arcbench-clips', prefix: 'range-a/' });
    expect(parseStorageUrl('s3://arcbench-clips/range-a/2026/')).toEqual({ bucket: 'arcbench-clips', prefix: 'range-a/2026/' });
    expect(parseStorageUrl('s3://arcbench-clips')).toEqual({ bucket: 'arcbench-clips', prefix: '' });
  });

  it('refuses bucket names S3 does not allow (3–63 characters, lower case; AWS S3 "Bucket naming rules")', () => {
    expect(() => parseStorageUrl('s3://ab/x')).toThrow(/3–63/);
    expect(() => parseStorageUrl(`s3://${'a'.repeat(64)}/x`)).toThrow(/3–63/);
    expect(() => parseStorageUrl('s3://Arcbench/x')).toThrow(/lower-case/);
    expect(() => parseStorageUrl('https://example.com/bucket')).toThrow(/s3:\/\/bucket\/prefix/);
  });

  it('local disk unless STORAGE_URL is set; path style and lean checksums for S3-compatible endpoints', () => {
    expect(loadConfig({ DATABASE_URL: 'postgres://x' }).storage).toEqual({ kind: 'local' });
    const s3 = loadConfig({ DATABASE_URL: 'postgres://x', STORAGE_URL: 's3://clips-bucket/p', S3_ENDPOINT: 'http://127.0.0.1:9000' }).storage;
    expect(s3).toMatchObject({ kind: 's3', bucket: 'clips-bucket', prefix: 'p/', forcePathStyle: true, checksumsWhenRequired: true, credentials: null });
    const aws = loadConfig({ DATABASE_URL: 'postgres://x', STORAGE_URL: 's3://clips-bucket/p', AWS_REGION: 'eu-central-1' }).storage;
    expect(aws).toMatchObject({ kind: 's3', endpoint: null, forcePathStyle: false, checksumsWhenRequired: false, region: 'eu-central-1' });
  });
});

describe('storage errors', () => {
  it('tells an unreachable store from a missing object', () => {
    expect(isStorageUnavailable(Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' }))).toBe(true);
    expect(isStorageUnavailable(new Error('wrapped', { cause: Object.assign(new Error('reset'), { code: 'ECONNRESET' }) }))).toBe(true);
    expect(isStorageUnavailable(Object.assign(new Error('Service Unavailable'), { $metadata: { httpStatusCode: 503 } }))).toBe(true);
    expect(isStorageUnavailable(new StorageUnavailableError('down'))).toBe(true);
    expect(isStorageUnavailable(Object.assign(new Error('NoSuchKey'), { name: 'NoSuchKey', $metadata: { httpStatusCode: 404 } }))).toBe(false);
    expect(isStorageUnavailable(Object.assign(new Error('Access Denied'), { $metadata: { httpStatusCode: 403 } }))).toBe(false);
    expect(isStorageUnavailable(new Error('ffmpeg exited with 1'))).toBe(false);
  });

  it('keys are plain relative paths', () => {
    expect(() => assertKey('teams/a/clips/b/original')).not.toThrow();
    for (const bad of ['/abs', 'a/../b', 'a//b', '', 'a/./b']) expect(() => assertKey(bad)).toThrow();
  });
});
