// `npm run dev`: the same database as `npm start`, the API with reload (tsx watch)
// and the Vite dev server with HMR (proxying /api to the API).
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { fail, log, run } from './lib/run.mjs';
import { ensureSystemPackages } from './lib/system-packages.mjs';
import { ensureNodeModules } from './lib/node-modules.mjs';
import { startCloneCluster } from './lib/pg-cluster.mjs';
import { s3FakeEnv, startS3Fake } from './lib/s3-fake.mjs';
import { sessionSecret } from './lib/secrets.mjs';
import { bin } from './lib/tool.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dataDir = path.join(root, '.data');

async function main() {
  await ensureSystemPackages(['postgresql', 'ffmpeg']);
  await ensureNodeModules(root);
  const cluster = await startCloneCluster(root, { preferredPort: 54329 });
  log(`PostgreSQL running on 127.0.0.1:${cluster.port}. ${cluster.where}`);
  const apiPort = process.env.API_PORT ?? '5181';
  const env = {
    ...process.env,
    DATABASE_URL: cluster.url('arcbench'),
    SESSION_SECRET: sessionSecret(dataDir),
    STORAGE_DIR: path.join(dataDir, 'storage'),
    PORT: apiPort,
    API_PORT: apiPort,
  };
  // ARCBENCH_S3_FAKE=1: clips and frames in the local S3 fake (s3rver, its data in .data/s3) instead of .data/storage.
  const s3Dir = path.join(dataDir, 's3');
  const firstS3 = !existsSync(s3Dir);
  const s3 = process.env.ARCBENCH_S3_FAKE === '1' ? await startS3Fake(s3Dir, ['arcbench-dev']) : null;
  if (s3) {
    Object.assign(env, s3FakeEnv(s3.endpoint, 'arcbench-dev', 'dev'));
    log(`Clips in the S3 fake at ${s3.endpoint} (bucket arcbench-dev, data in .data/s3)`);
    // The first time, the store gets what local disk already holds (same keys).
    if (firstS3) await run(bin(root, 'tsx'), ['server/storage/copy-objects.ts', path.join(dataDir, 'storage')], { cwd: root, env });
  }
  await run(bin(root, 'tsx'), ['server/cli/seed.ts'], { cwd: root, env });
  const children = [
    spawn(bin(root, 'tsx'), ['watch', '--clear-screen=false', 'server/index.ts'], { cwd: root, env, stdio: 'inherit' }),
    spawn(bin(root, 'vite'), ['--host', '127.0.0.1', '--port', '5173'], { cwd: root, env, stdio: 'inherit' }),
  ];
  log('Dev: app on http://127.0.0.1:5173 (HMR), API on http://127.0.0.1:' + apiPort);
  const stop = async () => {
    for (const c of children) c.kill('SIGTERM');
    await Promise.all(children.map((c) => (c.exitCode === null ? new Promise((r) => c.once('exit', r)) : null)));
    await s3?.stop();
    await cluster.stop();
    process.exit(0);
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => fail(err.message));
