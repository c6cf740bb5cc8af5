// `npm run bench`: speed checks on a throwaway environment. Each check prints
// its numbers as a ratio against a baseline measured in the same process.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { fail, log, runStatus } from './lib/run.mjs';
import { ensureSystemPackages } from './lib/system-packages.mjs';
import { ensureNodeModules } from './lib/node-modules.mjs';
import { startThrowaway } from './lib/throwaway.mjs';
import { bin } from './lib/tool.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

async function main() {
  await ensureSystemPackages(['postgresql', 'ffmpeg', 'chromium']);
  await ensureNodeModules(root);
  const { env, cleanup } = await startThrowaway(root, { database: 'arcbench_bench' });
  try {
    log('Building the client for the browser checks');
    await runStatus(bin(root, 'vite'), ['build', '--logLevel', 'warn', '--outDir', env.CLIENT_DIST, '--emptyOutDir'], { cwd: root, env });
    // Bytes per route chunk and the sign-in page's first load against its budget (issue 14).
    const bundleOk = (await runStatus(process.execPath, ['scripts/bench-bundle.mjs', env.CLIENT_DIST], { cwd: root, env })) === 0;
    const benchCode = await runStatus(bin(root, 'tsx'), ['scripts/bench.ts', ...process.argv.slice(2)], { cwd: root, env });
    process.exitCode = bundleOk ? benchCode : 1;
  } finally {
    await cleanup();
  }
}

main().catch((err) => fail(err.message));
