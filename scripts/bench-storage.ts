// Scale-out speed on the object store, as ratios against baselines measured in
// the same run: (1) extraction throughput of two worker processes against one,
// on the same clips in the S3 fake; (2) upload throughput into the S3 fake
// (multipart through lib-storage) against local disk.
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdtemp, rm, stat } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { eq, inArray } from 'drizzle-orm';
import { s3FakeEnv, startS3Fake } from './lib/s3-fake.mjs';
import { inspectClip } from '../server/clips/intake';
import { storeClip } from '../server/clips/store-clip';
import { loadConfig } from '../server/config';
import { connect } from '../server/db/client';
import { clips } from '../server/db/schema/clips';
import { shots, testSeries } from '../server/db/schema/records';
import { teams } from '../server/db/schema/teams';
import { generatePreset } from '../server/fixtures/clip-generator';
import { startJobQueue } from '../server/jobs/queue';
import { DEMO_TEAM } from '../server/seed/demo-people';
import { createStorage } from '../server/storage/create-storage';
import { localDiskStorage } from '../server/storage/local-disk';

const CLIPS = 4;
const FRAMES = 300;
const UPLOAD_BYTES = 256 * 1024 ** 2;
const ROUNDS = 3;
const BUCKET = 'arcbench-bench';
const root = path.resolve(import.meta.dirname, '..');

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function timed(fn: () => Promise<void>): Promise<number> {
  const start = performance.now();
  await fn();
  return (performance.now() - start) / 1000;
}

function startWorker(env: NodeJS.ProcessEnv): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/worker.ts'], { cwd: root, env, stdio: ['ignore', 'ignore', 'pipe', 'ipc'] });
  let err = '';
  child.stderr!.on('data', (d) => (err += d));
  return new Promise((resolve, reject) => {
    child.on('message', (m: { ready?: boolean }) => m.ready && resolve(child));
    child.on('exit', (code) => reject(new Error(`worker exited (${code}):\n${err}`)));
  });
}

const stopWorker = (child: ChildProcess) =>
  new Promise<void>((r) => {
    if (child.exitCode !== null) return r();
    child.once('exit', () => r());
    child.kill('SIGTERM');
  });

export async function benchStorage(): Promise<string> {
  const work = await mkdtemp(path.join(process.env.ARCBENCH_TMP ?? os.tmpdir(), 'bench-storage-'));
  const fake = await startS3Fake(path.join(work, 's3'), [BUCKET]);
  const storageEnv = s3FakeEnv(fake.endpoint, BUCKET, 'bench');
  const config = loadConfig({ ...process.env, ...storageEnv });
  const s3 = createStorage(config, path.join(work, 'scratch'));
  const local = localDiskStorage(path.join(work, 'local'));
  const database = connect(config.databaseUrl, 2);
  const lines: string[] = [];
  try {
    // (2) Uploads: the same bytes streamed in 64 KiB chunks, as an HTTP upload arrives.
    const data = randomBytes(UPLOAD_BYTES);
    const body = () => Readable.from((function* () {
      for (let i = 0; i < data.length; i += 65_536) yield data.subarray(i, i + 65_536);
    })());
    const localRuns: number[] = [];
    const s3Runs: number[] = [];
    for (let round = 0; round < ROUNDS; round++) {
      localRuns.push(await timed(async () => void (await local.put(`upload/${round}`, body()))));
      s3Runs.push(await timed(async () => void (await s3.put(`upload/${round}`, body()))));
    }
    const mbps = (s: number) => UPLOAD_BYTES / 1024 ** 2 / s;
    lines.push(
      `upload of ${UPLOAD_BYTES / 1024 ** 2} MiB (median of ${ROUNDS}):`,
      `  local disk:                 ${mbps(median(localRuns)).toFixed(0)} MiB/s (baseline)`,
      `  S3 fake, multipart (8 MiB parts, 2 in flight): ${mbps(median(s3Runs)).toFixed(0)} MiB/s   ratio ${(median(localRuns) / median(s3Runs)).toFixed(3)}`,
    );
    await s3.deletePrefix('upload/');

    // (1) Extraction: the same clips, once with one worker process and once with two.
    const [team] = await database.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
    const [series] = await database.db.insert(testSeries).values({ teamId: team.id, name: `storage bench ${Date.now()}`, testDate: '2026-05-01' }).returning();
    const [shot] = await database.db.insert(shots).values({ teamId: team.id, seriesId: series.id, label: 'storage bench' }).returning();
    const clipIds: string[] = [];
    for (let i = 0; i < CLIPS; i++) {
      const clip = await generatePreset('clean', path.join(work, `clip-${i}`), { name: `bench-${i}`, frameCount: FRAMES });
      const size = (await stat(clip.videoPath)).size;
      clipIds.push(
        await storeClip(database.db, s3, {
          teamId: team.id, shotId: shot.id, file: clip.videoPath, facts: await inspectClip(clip.videoPath, size, `bench-${i}.mp4`), originalName: `bench-${i}.mp4`,
          sha256: `bench-${Date.now()}-${i}`, sizeBytes: size, captureFps: 240, inFrame: 0, outFrame: FRAMES - 1, createdBy: null,
        }),
      );
    }
    const extractAll = async (workers: number): Promise<number> => {
      const schema = `pgboss_bench_${workers}_${Date.now().toString(36)}`;
      const queue = await startJobQueue({ ...config, jobSchema: schema }, database.db, { supervise: false });
      const procs = await Promise.all(
        Array.from({ length: workers }, (_, i) =>
          startWorker({ PATH: process.env.PATH, HOME: process.env.HOME, DATABASE_URL: config.databaseUrl, ...storageEnv, JOB_SCHEMA: schema, SCRATCH_DIR: path.join(work, `w${workers}-${i}`) }),
        ),
      );
      try {
        return await timed(async () => {
          for (const id of clipIds) await queue.jobs.enqueueExtraction(id);
          for (;;) {
            const rows = await database.db.select({ status: clips.status }).from(clips).where(inArray(clips.id, clipIds));
            if (rows.some((r) => r.status === 'failed' || r.status === 'cancelled')) throw new Error('a bench extraction failed');
            if (rows.every((r) => r.status === 'ready')) return;
            await new Promise((r) => setTimeout(r, 100));
          }
        });
      } finally {
        await Promise.all(procs.map(stopWorker));
        await queue.stop();
      }
    };
    const one = await extractAll(1);
    const two = await extractAll(2);
    const fps = (s: number) => (CLIPS * FRAMES) / s;
    lines.push(
      `extraction of ${CLIPS} clips × ${FRAMES} frames from the S3 fake (download, ffmpeg, frame uploads, rows):`,
      `  one worker process:   ${fps(one).toFixed(0)} frames/s (baseline)`,
      `  two worker processes: ${fps(two).toFixed(0)} frames/s   ratio ${(one / two).toFixed(3)} (on ${os.cpus().length} cores; ffmpeg already uses several per job)`,
    );
    await s3.deletePrefix(`teams/${team.id}/clips/`).catch(() => {});
    await database.db.delete(clips).where(eq(clips.shotId, shot.id));
    await database.db.delete(testSeries).where(eq(testSeries.id, series.id));
  } finally {
    await database.close();
    await fake.stop();
    await rm(work, { recursive: true, force: true });
  }
  return lines.join('\n');
}
