// The S3 driver against the fake (s3rver in its own process; project api-s3).
// Two things the fake on Node 20 gets wrong unless we take care
// (../shared/notes/s3-fake-on-node20.md): a streamed upload stored with the
// SDK's aws-chunked framing as data (the stored size grows), and listings of
// more than 1000 keys (one page of ListObjectsV2 is at most 1000 keys — the
// S3 API reference, ListObjectsV2 "MaxKeys") that need the legacy OpenSSL
// provider in the fake's process.
import { createHash, randomBytes } from 'node:crypto';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { Readable } from 'node:stream';
import { GetObjectCommand, HeadObjectCommand } from '@aws-sdk/client-s3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { generatePreset, type GeneratedClip } from '../../server/fixtures/clip-generator';
import { DEMO_PASSWORD, demoPerson } from '../../server/seed/demo-people';
import { PART_SIZE_BYTES, s3Storage } from '../../server/storage/s3';
import { readAll } from '../../server/storage/storage';
import { s3Run } from '../support/api-s3-run';
import { createShot, demoTeamId, fixtureDir, uploadClip } from '../support/clips';
import { createTestApp, signInAs, uniqueSuffix, type TestApp } from '../support/test-app';

const s3 = s3Run();
const suffix = uniqueSuffix();
let t: TestApp;
let clip: GeneratedClip;

function driver(prefix: string) {
  const settings = loadConfig({ DATABASE_URL: process.env.DATABASE_URL, ...s3!.storageEnv, STORAGE_URL: `s3://${s3!.bucket}/${prefix}` }).storage;
  if (settings.kind !== 's3') throw new Error('expected S3 settings');
  return s3Storage({ ...settings, tempDir: s3!.newLocalStorageDir('driver-scratch') });
}

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

beforeAll(async () => {
  t = await createTestApp({ signInLimitPerWindow: 1000 });
  clip = await generatePreset('clean', fixtureDir('driver'), { frameCount: 30 });
}, 180_000);
afterAll(() => t?.close());

describe.runIf(s3)('the S3 driver on the fake', () => {
  it('stores exactly the bytes streamed to it, in one part and in several (no aws-chunked framing kept)', async () => {
    const store = driver(`driver-${suffix}`);
    // 3,000,000 bytes: the size the note saw grow to 3,000,449; and one of three multipart parts.
    for (const size of [3_000_000, 2 * PART_SIZE_BYTES + 12_345]) {
      const body = randomBytes(size);
      const key = `sizes/${size}.bin`;
      // Streamed in odd-sized chunks, as an HTTP upload arrives.
      const chunks = Array.from({ length: Math.ceil(size / 65_521) }, (_, i) => body.subarray(i * 65_521, (i + 1) * 65_521));
      const stored = await store.put(key, Readable.from(chunks));
      expect(stored.sizeBytes).toBe(size);
      const head = await store.client.send(new HeadObjectCommand({ Bucket: store.bucket, Key: `${store.prefix}${key}` }));
      expect(head.ContentLength).toBe(size);
      const back = await store.client.send(new GetObjectCommand({ Bucket: store.bucket, Key: `${store.prefix}${key}` }));
      expect(sha256(Buffer.from(await back.Body!.transformToByteArray()))).toBe(sha256(body));
    }
    await store.deletePrefix('sizes/');
    expect(await store.list('sizes/')).toEqual([]);
  });

  it('lists, and deletes, more than 1000 keys under one prefix', async () => {
    const store = driver(`many-${suffix}`);
    const dir = mkdtempSync(path.join(process.env.ARCBENCH_TMP!, 'many-'));
    const names = Array.from({ length: 1005 }, (_, i) => `${String(i).padStart(6, '0')}.jpg`);
    for (const name of names) writeFileSync(path.join(dir, name), name);
    const stored = await store.putDirectory('set/', dir);
    expect(stored.map((o) => o.key)).toEqual(names.map((n) => `set/${n}`));
    expect(await store.list('set/')).toEqual(names.map((n) => `set/${n}`));
    expect((await readAll(store, 'set/001004.jpg')).toString()).toBe('001004.jpg');
    await store.deletePrefix('set/');
    expect(await store.list('set/')).toEqual([]);
  });

  it('an uploaded clip is stored with the size and SHA-256 of the file sent', async () => {
    const teamId = await demoTeamId(t.deps.db);
    const shotId = await createShot(t.deps.db, teamId, suffix);
    const analyst = await signInAs(t.app, demoPerson('analyst').email, DEMO_PASSWORD);
    const res = await uploadClip(analyst, teamId, shotId, clip.videoPath, { captureFps: 240 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const sent = readFileSync(clip.videoPath);
    const [key] = (await t.deps.storage.list(`teams/${teamId}/clips/${res.body.id}/`)).filter((k) => k.endsWith('/original'));
    const stat = await t.deps.storage.stat(key);
    expect(stat?.sizeBytes).toBe(sent.length);
    expect(res.body.sizeBytes).toBe(sent.length);
    expect(sha256(await readAll(t.deps.storage, key))).toBe(sha256(sent));
    expect(res.body.sha256).toBe(sha256(sent));
  });
});
