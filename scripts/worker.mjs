// `npm run worker`: the extraction worker as a separate process. With
// DATABASE_URL set it joins that database (another machine scaling out) and
// needs nothing else but the storage settings (STORAGE_URL=s3://… with the
// S3_*/AWS_* variables, or STORAGE_DIR on a disk shared with the server);
// otherwise it uses the private PostgreSQL of `npm start` (see scripts/lib/pg-cluster.mjs)
// and its storage in .data/.
// Builtins only until `npm ci` has run.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { fail, log } from './lib/run.mjs';
import { ensureSystemPackages } from './lib/system-packages.mjs';
import { ensureNodeModules } from './lib/node-modules.mjs';
import { startCloneCluster } from './lib/pg-cluster.mjs';
import { sessionSecret } from './lib/secrets.mjs';
import { bin } from './lib/tool.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dataDir = path.join(root, '.data');

async function main() {
  const remote = Boolean(process.env.DATABASE_URL);
  await ensureSystemPackages(remote ? ['ffmpeg'] : ['postgresql', 'ffmpeg']);
  await ensureNodeModules(root);
  let databaseUrl = process.env.DATABASE_URL;
  if (!remote) {
    const cluster = await startCloneCluster(root, { preferredPort: 54329 });
    databaseUrl = cluster.url('arcbench');
    // The cluster is shared with `npm start`, so the worker leaves it running when it stops.
    log(`Using PostgreSQL on 127.0.0.1:${cluster.port}. ${cluster.where}`);
  }
  // A worker on its own machine has no .data/ of `npm start`: only the local set-up gets those defaults.
  const env = remote
    ? { ...process.env }
    : {
        ...process.env,
        DATABASE_URL: databaseUrl,
        SESSION_SECRET: process.env.SESSION_SECRET ?? sessionSecret(dataDir),
        STORAGE_DIR: process.env.STORAGE_DIR ?? path.join(dataDir, 'storage'),
      };
  const worker = spawn(bin(root, 'tsx'), ['server/worker.ts'], { cwd: root, env, stdio: 'inherit' });
  const forward = (signal) => worker.exitCode === null && worker.kill(signal);
  process.on('SIGINT', () => forward('SIGTERM'));
  process.on('SIGTERM', () => forward('SIGTERM'));
  worker.on('exit', (code) => process.exit(code ?? 1));
}

main().catch((err) => fail(err.message));
