// The client's files: hashed assets go out precompressed (brotli or gzip, as the
// browser accepts) and cached for a year; index.html is revalidated every time.
// Header meanings: RFC 9110 §8.4 (Content-Encoding), §12.5.5 (Vary); RFC 9111 §5.2.2.2
// (no-cache) and RFC 8246 (immutable).
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { createTestApp, type TestApp } from '../support/test-app';

/** The body as bytes (supertest has already undone the Content-Encoding; Content-Length tells what crossed the wire). */
function rawBody(res: request.Response, done: (err: Error | null, body: Buffer) => void) {
  const parts: Buffer[] = [];
  const stream = res as unknown as NodeJS.ReadableStream;
  stream.on('data', (c: Buffer) => parts.push(c));
  stream.on('end', () => done(null, Buffer.concat(parts)));
}

const plainSize = (dist: string) => readFileSync(path.join(dist, 'assets', 'main-Ab12Cd34.js')).length;

async function fetchAsset(app: TestApp['app'], url: string, acceptEncoding: string) {
  return request(app).get(url).set('Accept-Encoding', acceptEncoding).buffer(true).parse(rawBody);
}

describe('static client files (a small build of our own: the server side)', () => {
  let t: TestApp;
  let dist: string;
  const script = `export const greeting = ${JSON.stringify('frame '.repeat(2000))};\n`;
  beforeAll(async () => {
    dist = mkdtempSync(path.join(os.tmpdir(), 'arcbench-dist-'));
    mkdirSync(path.join(dist, 'assets'));
    writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>t</title><script type="module" src="/assets/main-Ab12Cd34.js"></script>');
    writeFileSync(path.join(dist, 'assets', 'main-Ab12Cd34.js'), script);
    writeFileSync(path.join(dist, 'assets', 'main-Ab12Cd34.js.br'), brotliCompressSync(script));
    writeFileSync(path.join(dist, 'assets', 'main-Ab12Cd34.js.gz'), gzipSync(script));
    expect(plainSize(dist)).toBeGreaterThan(brotliCompressSync(script).length);
    t = await createTestApp({ clientDist: dist });
  });
  afterAll(async () => {
    await t.close();
    rmSync(dist, { recursive: true, force: true });
  });

  it('sends the brotli twin to a browser that accepts br, cached for a year', async () => {
    const res = await fetchAsset(t.app, '/assets/main-Ab12Cd34.js', 'gzip, deflate, br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['vary']).toMatch(/Accept-Encoding/i);
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(Number(res.headers['content-length'])).toBe(brotliCompressSync(script).length);
    expect((res.body as Buffer).toString()).toBe(script);
  });

  it('sends the gzip twin when br is not accepted, and the plain file when nothing is', async () => {
    const gz = await fetchAsset(t.app, '/assets/main-Ab12Cd34.js', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(Number(gz.headers['content-length'])).toBe(gzipSync(script).length);
    expect((gz.body as Buffer).toString()).toBe(script);
    const plain = await fetchAsset(t.app, '/assets/main-Ab12Cd34.js', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect((plain.body as Buffer).toString()).toBe(script);
    expect(plain.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('serves index.html (and every client route) with no-cache', async () => {
    for (const url of ['/', '/sign-in', '/t/some-team/shots']) {
      const res = await request(t.app).get(url);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('no-cache');
      expect(res.text).toContain('/assets/main-Ab12Cd34.js');
    }
  });

  it('answers a missing asset with 404, not index.html', async () => {
    const res = await request(t.app).get('/assets/gone-00000000.js');
    expect(res.status).toBe(404);
  });
});

// The real client build (npm test builds it into CLIENT_DIST before vitest; a focused
// run with SKIP_BUILD=1 has none, and then only the part above runs).
const built = loadConfig().clientDist;
const hasBuild = existsSync(path.join(built, 'index.html'));

describe.skipIf(!hasBuild)('the real client build', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('has brotli and gzip twins of every script and stylesheet, served with Content-Encoding and a year of caching', async () => {
    const assets = readdirSync(path.join(built, 'assets')).filter((f) => /\.(js|css)$/.test(f));
    expect(assets.length).toBeGreaterThan(3);
    const entry = /src="\/assets\/([^"]+\.js)"/.exec(readFileSync(path.join(built, 'index.html'), 'utf8'))?.[1];
    expect(entry).toBeTruthy();
    for (const name of assets) {
      const size = readFileSync(path.join(built, 'assets', name)).length;
      // The plugin skips files under 1 KiB, where compression does not pay.
      if (size < 1024) continue;
      expect(existsSync(path.join(built, 'assets', `${name}.br`)), `${name}.br`).toBe(true);
      expect(existsSync(path.join(built, 'assets', `${name}.gz`)), `${name}.gz`).toBe(true);
    }
    const res = await fetchAsset(t.app, `/assets/${entry}`, 'gzip, deflate, br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['vary']).toMatch(/Accept-Encoding/i);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(Number(res.headers['content-length'])).toBe(readFileSync(path.join(built, 'assets', `${entry}.br`)).length);
    expect((res.body as Buffer).equals(readFileSync(path.join(built, 'assets', entry!)))).toBe(true);
    const page = await request(t.app).get('/sign-in');
    expect(page.headers['cache-control']).toBe('no-cache');
  });
});
