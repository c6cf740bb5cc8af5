// A throwaway environment for tests and benchmarks: a fresh cluster in a temp
// folder on a free port, migrated and seeded; `cleanup()` removes it all.
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { log, run } from './run.mjs';
import { freePort, startCluster } from './pg-cluster.mjs';
import { bin } from './tool.mjs';

export async function startThrowaway(root, { database = 'arcbench_test' } = {}) {
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'arcbench-test-'));
  chmodSync(tmp, 0o755);
  process.env.ARCBENCH_PG_FSYNC = 'off'; // a throwaway cluster need not survive a power cut
  const cluster = await startCluster(tmp, { preferredPort: await freePort() });
  log(`Throwaway PostgreSQL on 127.0.0.1:${cluster.port} in ${tmp}`);
  let cleaned = false;
  const cleanup = async () => {
    if (cleaned) return;
    cleaned = true;
    await cluster.stop();
    rmSync(tmp, { recursive: true, force: true });
  };
  const onSignal = async () => {
    await cleanup();
    process.exit(130);
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  const env = {
    ...process.env,
    DATABASE_URL: cluster.url(database),
    STORAGE_DIR: path.join(tmp, 'storage'),
    ARCBENCH_TMP: tmp,
    ARTIFACTS_DIR: path.join(root, 'test-artifacts'),
    // The test build goes to the temp folder, so parallel runs never share dist/.
    CLIENT_DIST: path.join(tmp, 'dist'),
  };
  try {
    await run(bin(root, 'tsx'), ['server/cli/seed.ts'], { cwd: root, env });
  } catch (err) {
    await cleanup();
    throw err;
  }
  return { tmp, env, cleanup };
}
