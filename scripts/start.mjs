// `npm start`: everything from a fresh clone to a running Arcbench.
// Builtins only until `npm ci` has run.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { log, fail, run } from './lib/run.mjs';
import { ensureSystemPackages } from './lib/system-packages.mjs';
import { ensureNodeModules } from './lib/node-modules.mjs';
import { startCloneCluster } from './lib/pg-cluster.mjs';
import { sessionSecret } from './lib/secrets.mjs';
import { bin } from './lib/tool.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dataDir = path.join(root, '.data');
// Production mode (as server/config.ts decides it): no demo team, no demo banner.
const production = process.env.NODE_ENV === 'production' || /^(off|false|no|0)$/i.test(process.env.ARCBENCH_DEMO ?? '');

async function main() {
  await ensureSystemPackages(['postgresql', 'ffmpeg']);
  await ensureNodeModules(root);
  const cluster = await startCloneCluster(root, { preferredPort: 54329 });
  log(`PostgreSQL running on 127.0.0.1:${cluster.port}. ${cluster.where}`);
  log(cluster.remove);
  let server = null;
  let stopping = false;
  const stop = async (code) => {
    if (stopping) return;
    stopping = true;
    if (server && server.exitCode === null) {
      server.kill('SIGTERM');
      await new Promise((resolve) => server.once('exit', resolve));
    }
    log('Stopping PostgreSQL');
    await cluster.stop();
    process.exit(code);
  };
  process.on('SIGINT', () => void stop(0));
  process.on('SIGTERM', () => void stop(0));

  const env = {
    ...process.env,
    DATABASE_URL: cluster.url('arcbench'),
    SESSION_SECRET: process.env.SESSION_SECRET ?? sessionSecret(dataDir),
    STORAGE_DIR: process.env.STORAGE_DIR ?? path.join(dataDir, 'storage'),
    PORT: process.env.PORT ?? '5180',
    HOST: process.env.HOST ?? '127.0.0.1',
  };
  try {
    log(production ? 'Applying migrations (production mode: no demo team)' : 'Applying migrations and seeding the demo team');
    await run(bin(root, 'tsx'), ['server/cli/seed.ts'], { cwd: root, env });
    log('Building the client');
    await run(bin(root, 'vite'), ['build', '--logLevel', 'warn'], { cwd: root, env });
  } catch (err) {
    log(err.message);
    await stop(1);
    return;
  }
  server = spawn(bin(root, 'tsx'), ['server/index.ts'], { cwd: root, env, stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
  server.on('message', async (msg) => {
    if (!msg?.ready) return;
    const { printSignIns, printProductionBanner } = await import('./lib/banner.mjs');
    if (production) printProductionBanner(msg.url);
    else printSignIns(msg.url);
  });
  server.on('exit', (code) => {
    if (!stopping) {
      log(`Server exited (${code}).`);
      void stop(code ?? 1);
    }
  });
}

main().catch((err) => fail(err.message));
