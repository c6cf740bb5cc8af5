// A throwaway environment for tests and benchmarks: a fresh cluster in a temp
// folder on a free port, migrated and seeded; `cleanup()` removes it all.
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { isRoot, log, run } from './run.mjs';
import { freePort, makeRootScratchHome, serviceUserCanReach, startCluster } from './pg-cluster.mjs';
import { bin } from './tool.mjs';

export async function startThrowaway(root, { database = 'arcbench_test' } = {}) {
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'arcbench-test-'));
  chmodSync(tmp, 0o755);
  // As root the cluster runs as `postgres`; when the temp folder is private
  // (TMPDIR under a 0700 home) it goes to a scratch folder under /var/lib/arcbench.
  const pgHome = isRoot() && !serviceUserCanReach(tmp) ? makeRootScratchHome('throwaway-') : tmp;
  process.env.ARCBENCH_PG_FSYNC = 'off'; // a throwaway cluster need not survive a power cut
  let cluster;
  try {
    cluster = await startCluster(pgHome, { preferredPort: await freePort() });
  } catch (err) {
    rmSync(tmp, { recursive: true, force: true });
    if (pgHome !== tmp) rmSync(pgHome, { recursive: true, force: true });
    throw err;
  }
  log(`Throwaway PostgreSQL on 127.0.0.1:${cluster.port} in ${pgHome} (removed when done)`);
  let cleaned = false;
  const cleanup = async () => {
    if (cleaned) return;
    cleaned = true;
    await cluster.stop();
    rmSync(tmp, { recursive: true, force: true });
    if (pgHome !== tmp) rmSync(pgHome, { recursive: true, force: true });
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
