// The 'api-s3' project: the clip, marking and fit API suites again, with clips
// and frames in the S3 fake (s3rver, started by scripts/test.mjs in its own
// process), the server's in-process worker off, and two `npm run worker`
// processes, each with its own scratch folder and nothing but the database and
// the S3 settings. At the end: nothing was written to any local storage folder.
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { createWriteStream, existsSync, mkdirSync, readFileSync, readdirSync, type Dirent } from 'node:fs';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { s3FakeEnv, startS3Fake } from '../../scripts/lib/s3-fake.mjs';
import { loadConfig } from '../../server/config';
import { copyObjects } from '../../server/storage/copy-objects';
import { createStorage } from '../../server/storage/create-storage';
import { localDiskStorage } from '../../server/storage/local-disk';

/** Every file under a folder (relative paths). */
function filesUnder(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return (readdirSync(dir, { recursive: true, withFileTypes: true }) as Dirent[])
    .filter((e) => e.isFile())
    .map((e) => path.relative(dir, path.join(e.parentPath, e.name)));
}

export const S3_BUCKET = 'arcbench-test';
/** Queue schema the two workers serve; every test app of the run sends its jobs there. */
export const S3_JOB_SCHEMA = 'pgboss_s3run';

export interface ArcbenchS3Context {
  /** Environment that points an Arcbench process at the fake (STORAGE_URL, S3_*, AWS_*). */
  storageEnv: Record<string, string>;
  endpoint: string;
  bucket: string;
  /** Key prefix of the shared run (below the bucket). */
  prefix: string;
  jobSchema: string;
  /** The workers' scratch folders. */
  workerScratchDirs: string[];
  /** Parent of every test app's local storage folder (STORAGE_DIR) in this run: must stay empty. */
  localStorageRoot: string;
}

declare module 'vitest' {
  export interface ProvidedContext {
    arcbenchS3: ArcbenchS3Context;
  }
}

const root = path.resolve(import.meta.dirname, '../..');
const WORKERS = 2;

interface WorkerProcess {
  npm: ChildProcess;
  /** The worker's own pid (npm → scripts/worker.mjs → tsx → node server/worker.ts). */
  pid: number;
}

function startWorker(n: number, env: NodeJS.ProcessEnv, logFile: string): Promise<WorkerProcess> {
  // `npm run worker`, as on another machine: detached, so teardown can signal npm and everything below it.
  const child = spawn('npm', ['run', '--silent', 'worker'], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'], detached: true });
  const log = createWriteStream(logFile);
  child.stdout!.pipe(log);
  child.stderr!.pipe(log);
  let seen = '';
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`worker ${n} not ready after 120 s; see ${logFile}`)), 120_000);
    child.stdout!.on('data', (d) => {
      seen += d;
      const ready = /\[arcbench\] worker (\d+):/.exec(seen);
      if (ready) {
        clearTimeout(timer);
        resolve({ npm: child, pid: Number(ready[1]) });
      }
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`worker ${n} exited (${code}) before it was ready:\n${existsSync(logFile) ? readFileSync(logFile, 'utf8') : seen}`));
    });
  });
}

const running = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

/** SIGTERM to the worker (as a process manager would), then wait until it has cleaned up and exited. */
async function stopWorker(w: WorkerProcess): Promise<void> {
  if (running(w.pid)) process.kill(w.pid, 'SIGTERM');
  for (let i = 0; i < 300 && running(w.pid); i++) await new Promise((r) => setTimeout(r, 100));
  if (w.npm.exitCode === null && w.npm.signalCode === null) {
    try {
      process.kill(-w.npm.pid!, 'SIGKILL');
    } catch {
      // already gone
    }
  }
}

export default async function setup(project: TestProject) {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run the API tests through `npm test`.');
  const tmp = process.env.ARCBENCH_TMP!;
  const runDir = path.join(tmp, 'api-s3');
  mkdirSync(runDir, { recursive: true });
  // scripts/test.mjs starts the fake; a run without it (vitest by hand) starts its own.
  const own = process.env.S3_FAKE_ENDPOINT ? null : await startS3Fake(path.join(runDir, 's3'), [S3_BUCKET]);
  const endpoint = process.env.S3_FAKE_ENDPOINT ?? own!.endpoint;
  const prefix = 'api-s3/';
  // A database of its own, freshly migrated and seeded: the local-disk run (project api) uploads
  // the same generated clips, so on one database its uploads would be duplicates here.
  const dbUrl = new URL(process.env.DATABASE_URL);
  dbUrl.pathname = `${dbUrl.pathname}_s3`;
  const root = path.resolve(import.meta.dirname, '../..');
  execFileSync(path.join(root, 'node_modules/.bin/tsx'), ['server/cli/seed.ts'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: dbUrl.toString() },
    stdio: 'inherit',
  });
  // DATABASE_URL rides with the storage settings, so the run's apps and workers all use that database.
  const storageEnv = { ...s3FakeEnv(endpoint, S3_BUCKET, prefix), DATABASE_URL: dbUrl.toString() };

  // The demo seed wrote its clips to local disk before the fake existed: give the store the same objects.
  const seedDir = process.env.STORAGE_DIR!;
  const store = createStorage(loadConfig({ ...storageEnv }), path.join(runDir, 'copy-scratch'));
  await copyObjects(localDiskStorage(seedDir), store);

  const localStorageRoot = path.join(runDir, 'local-storage');
  mkdirSync(localStorageRoot, { recursive: true });
  const workerScratchDirs = Array.from({ length: WORKERS }, (_, i) => path.join(runDir, `worker-${i + 1}-scratch`));
  // Workers get a STORAGE_DIR that must never appear: proof they need no local storage.
  const workerStorageDirs = Array.from({ length: WORKERS }, (_, i) => path.join(runDir, `worker-${i + 1}-no-local-storage`));
  const workers = await Promise.all(
    workerScratchDirs.map((scratch, i) =>
      startWorker(
        i + 1,
        {
          PATH: process.env.PATH,
          HOME: process.env.HOME,
          ...storageEnv,
          STORAGE_DIR: workerStorageDirs[i],
          SCRATCH_DIR: scratch,
          JOB_SCHEMA: S3_JOB_SCHEMA,
          WORKER_CONCURRENCY: '2',
          JOB_STALE_SECONDS: '10',
          WORKER_STOP_GRACE_SECONDS: '5',
        },
        path.join(runDir, `worker-${i + 1}.log`),
      ),
    ),
  );

  project.provide('arcbenchS3', { storageEnv, endpoint, bucket: S3_BUCKET, prefix, jobSchema: S3_JOB_SCHEMA, workerScratchDirs, localStorageRoot });

  return async () => {
    await Promise.all(workers.map(stopWorker));
    await own?.stop();
    const problems: string[] = [];
    const written = filesUnder(localStorageRoot);
    if (written.length > 0) problems.push(`files in the test apps' local storage folders: ${written.slice(0, 5).join(', ')}`);
    for (const dir of workerStorageDirs) if (existsSync(dir)) problems.push(`a worker created the local storage folder ${dir}`);
    for (const dir of workerScratchDirs) if (existsSync(dir)) problems.push(`a worker left its scratch folder ${dir} behind`);
    if (problems.length > 0) throw new Error(`S3 run wrote to local storage:\n${problems.join('\n')}`);
  };
}
