// Clip pipeline speed and memory, as ratios against baselines measured in the
// same run: (1) frame extraction through our ffmpeg module and through the
// whole job versus the same ffmpeg command run directly; (2) the server's
// peak RSS growth while a 1 GiB upload streams through it.
import { spawn } from 'node:child_process';
import { mkdir, mkdtemp, readFile, readdir, rm, stat } from 'node:fs/promises';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { eq } from 'drizzle-orm';
import { createApp } from '../server/app';
import type { AppDeps } from '../server/app-deps';
import { loadConfig } from '../server/config';
import { connect } from '../server/db/client';
import { clips } from '../server/db/schema/clips';
import { shots, testSeries } from '../server/db/schema/records';
import { teams } from '../server/db/schema/teams';
import { generatePreset } from '../server/fixtures/clip-generator';
import { extractNow, thumbnailFrames, THUMBNAIL_WIDTH_PX } from '../server/jobs/extract-frames';
import { createMailer } from '../server/mail/mailer';
import { extractFrames, extractFramesArgs, type ExtractFramesOptions } from '../server/media/ffmpeg';
import { DEMO_PASSWORD, DEMO_TEAM, demoPerson } from '../server/seed/demo-people';
import { localDiskStorage } from '../server/storage/local-disk';
import { inspectClip } from '../server/clips/intake';
import { storeClip } from '../server/clips/store-clip';

const FRAMES = 600;
const ROUNDS = 3;
const UPLOAD_BYTES = 1024 ** 3;

function runDirect(args: string[]): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.env.FFMPEG_PATH || 'ffmpeg', args, { stdio: ['ignore', 'ignore', 'pipe'] });
    child.stderr.resume();
    child.on('error', reject);
    child.on('close', (code) => (code === 0 ? resolve() : reject(new Error(`ffmpeg exited with ${code}`))));
  });
}

async function timed(fn: () => Promise<void>): Promise<number> {
  const start = performance.now();
  await fn();
  return (performance.now() - start) / 1000;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function extractionBench(work: string): Promise<string[]> {
  const clip = await generatePreset('clean', path.join(work, 'clip'), { name: 'bench', frameCount: FRAMES });
  const config = loadConfig();
  const options = async (label: string): Promise<Omit<ExtractFramesOptions, 'onProgress' | 'signal'>> => {
    const outDir = path.join(work, label);
    const thumbsDir = path.join(work, `${label}-thumbs`);
    await rm(outDir, { recursive: true, force: true });
    await rm(thumbsDir, { recursive: true, force: true });
    await mkdir(outDir, { recursive: true });
    await mkdir(thumbsDir, { recursive: true });
    return {
      input: clip.videoPath,
      outDir,
      inFrame: 0,
      outFrame: FRAMES - 1,
      jpegQuality: config.jpegQuality,
      thumbnails: { outDir: thumbsDir, frameNumbers: thumbnailFrames(0, FRAMES - 1), widthPx: THUMBNAIL_WIDTH_PX, jpegQuality: 80 },
    };
  };

  // One untimed run each first: fluent-ffmpeg asks ffmpeg for its formats and
  // encoders once per process (cached after), and the page cache warms up.
  await runDirect(extractFramesArgs(await options('direct')));
  await extractFrames(await options('wrapped'));
  const direct: number[] = [];
  const wrapped: number[] = [];
  // Interleaved rounds, so a busy neighbour slows both sides alike.
  for (let round = 0; round < ROUNDS; round++) {
    const a = await options('direct');
    direct.push(await timed(() => runDirect(extractFramesArgs(a))));
    const b = await options('wrapped');
    let last = 0;
    wrapped.push(await timed(() => extractFrames({ ...b, onProgress: (n) => (last = n) })));
    if ((await readdir(b.outDir)).length !== FRAMES || last <= 0) throw new Error('the wrapped extraction did not write every frame');
  }
  const fpsDirect = FRAMES / median(direct);
  const fpsWrapped = FRAMES / median(wrapped);
  const lines = [
    `extraction of ${FRAMES} frames (${clip.truth.width}×${clip.truth.height} H.264 → JPEG q${config.jpegQuality} + thumbnail strip), median of ${ROUNDS}:`,
    `  ffmpeg run directly:            ${fpsDirect.toFixed(0)} frames/s`,
    `  through server/media/ffmpeg.ts: ${fpsWrapped.toFixed(0)} frames/s   ratio ${(fpsWrapped / fpsDirect).toFixed(3)} (target ≥ 0.9)`,
  ];

  // The whole job: probe, timestamps, extraction, moves into storage, frame rows, swap.
  const database = connect(config.databaseUrl, 2);
  try {
    const [team] = await database.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
    const [series] = await database.db.insert(testSeries).values({ teamId: team.id, name: `bench ${Date.now()}`, testDate: '2026-05-01' }).returning();
    const [shot] = await database.db.insert(shots).values({ teamId: team.id, seriesId: series.id, label: 'bench' }).returning();
    const storage = localDiskStorage(path.join(work, 'storage'));
    const copy = path.join(work, 'bench-copy.mp4');
    await import('node:fs/promises').then((fs) => fs.copyFile(clip.videoPath, copy));
    const size = (await stat(copy)).size;
    const clipId = await storeClip(database.db, storage, {
      teamId: team.id, shotId: shot.id, file: copy, facts: await inspectClip(copy, size, 'bench.mp4'), originalName: 'bench.mp4',
      sha256: `bench-${Date.now()}`, sizeBytes: size, captureFps: 240, inFrame: 0, outFrame: FRAMES - 1, createdBy: null,
    });
    const jobRuns: number[] = [];
    for (let round = 0; round < ROUNDS; round++) jobRuns.push(await timed(() => extractNow({ db: database.db, storage, config }, clipId)));
    const [row] = await database.db.select({ status: clips.status, n: clips.extractedCount }).from(clips).where(eq(clips.id, clipId));
    if (row.status !== 'ready' || row.n !== FRAMES) throw new Error(`bench job ended ${row.status} with ${row.n} frames`);
    const fpsJob = FRAMES / median(jobRuns);
    lines.push(`  whole extraction job:           ${fpsJob.toFixed(0)} frames/s   ratio ${(fpsJob / fpsDirect).toFixed(3)} (storage moves, frame rows, swap and clean-up of the previous frame set included)`);
    await database.db.delete(testSeries).where(eq(testSeries.id, series.id));
  } finally {
    await database.close();
  }
  return lines;
}

/** A multipart body: a real small MP4 followed by `padBytes` of zeros, generated as it is sent (never held in memory). */
function multipartStream(mp4: Buffer, padBytes: number, boundary: string): { stream: Readable; length: number } {
  const head = Buffer.from(
    `--${boundary}\r\nContent-Disposition: form-data; name="captureFps"\r\n\r\n240\r\n` +
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="long-take.mp4"\r\nContent-Type: video/mp4\r\n\r\n`,
  );
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
  const chunk = Buffer.alloc(256 * 1024);
  let sent = 0;
  let stage = 0;
  const stream = new Readable({
    read() {
      if (stage === 0) {
        stage = 1;
        this.push(Buffer.concat([head, mp4]));
      } else if (stage === 1) {
        const n = Math.min(chunk.length, padBytes - sent);
        sent += n;
        this.push(n === chunk.length ? chunk : chunk.subarray(0, n));
        if (sent >= padBytes) stage = 2;
      } else if (stage === 2) {
        stage = 3;
        this.push(tail);
      } else this.push(null);
    },
  });
  return { stream, length: head.length + mp4.length + padBytes + tail.length };
}

async function uploadMemoryBench(work: string): Promise<string[]> {
  const config = { ...loadConfig(), storageDir: path.join(work, 'upload-storage'), signInLimitPerWindow: 1000 };
  const database = connect(config.databaseUrl, 4);
  const mailer = createMailer('smtp://127.0.0.1:9', config.mailFrom);
  const deps: AppDeps = { config, db: database.db, pool: database.pool, mailer, storage: localDiskStorage(config.storageDir) };
  const server = http.createServer(createApp(deps)).listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const { port } = server.address() as AddressInfo;
  const base = `http://127.0.0.1:${port}`;
  let seriesId: string | null = null;
  try {
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', 'X-Arcbench-Request': '1' },
      body: JSON.stringify({ email: demoPerson('analyst').email, password: DEMO_PASSWORD }),
    });
    const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
    const [team] = await database.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
    const [series] = await database.db.insert(testSeries).values({ teamId: team.id, name: `bench upload ${Date.now()}`, testDate: '2026-05-01' }).returning();
    seriesId = series.id;
    const [shot] = await database.db.insert(shots).values({ teamId: team.id, seriesId: series.id, label: 'bench upload' }).returning();
    const small = await generatePreset('clean', path.join(work, 'upload-clip'), { name: 'small', frameCount: 12 });
    const mp4 = await readFile(small.videoPath);

    global.gc?.();
    const baseline = process.memoryUsage().rss;
    let peak = baseline;
    const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 20);
    const boundary = '----arcbench-bench';
    const { stream, length } = multipartStream(mp4, UPLOAD_BYTES, boundary);
    const started = performance.now();
    const status = await new Promise<{ code: number; body: string }>((resolve, reject) => {
      const req = http.request(
        {
          host: '127.0.0.1', port, method: 'POST', path: `/api/teams/${team.id}/shots/${shot.id}/clips`,
          headers: { 'Content-Type': `multipart/form-data; boundary=${boundary}`, 'Content-Length': String(length), 'X-Arcbench-Request': '1', Cookie: cookie },
        },
        (res) => {
          let body = '';
          res.on('data', (d) => (body += d));
          res.on('end', () => resolve({ code: res.statusCode ?? 0, body }));
        },
      );
      req.on('error', reject);
      stream.pipe(req);
    });
    const seconds = (performance.now() - started) / 1000;
    clearInterval(sampler);
    peak = Math.max(peak, process.memoryUsage().rss);
    const mib = (b: number) => (b / 1024 ** 2).toFixed(1);
    return [
      `upload of ${mib(length)} MiB streamed through the server in ${seconds.toFixed(1)} s (${mib(length / seconds)} MiB/s), answered ${status.code}:`,
      `  RSS before ${mib(baseline)} MiB, peak ${mib(peak)} MiB: peak growth ${mib(peak - baseline)} MiB (${((100 * (peak - baseline)) / length).toFixed(2)} % of the upload; flat means it is streamed, not buffered)`,
    ];
  } finally {
    if (seriesId) await database.db.delete(testSeries).where(eq(testSeries.id, seriesId));
    server.close();
    server.closeAllConnections();
    mailer.close();
    await database.close();
  }
}

export async function benchClips(): Promise<string> {
  const work = await mkdtemp(path.join(process.env.ARCBENCH_TMP ?? os.tmpdir(), 'bench-clips-'));
  try {
    const lines = await extractionBench(work);
    lines.push(...(await uploadMemoryBench(work)));
    return lines.join('\n');
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
