// `npm test`: the same set-up as `npm start`, against a throwaway cluster in a
// temp folder on a free port; then type-check, unit + API tests, browser tests.
// Everything is torn down afterwards, also on failure.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { log, runStatus } from './lib/run.mjs';
import { ensureSystemPackages } from './lib/system-packages.mjs';
import { ensureNodeModules } from './lib/node-modules.mjs';
import { startThrowaway } from './lib/throwaway.mjs';
import { startS3Fake } from './lib/s3-fake.mjs';
import { bin } from './lib/tool.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const extraArgs = process.argv.slice(2);

async function main() {
  await ensureSystemPackages(['postgresql', 'ffmpeg', 'chromium']);
  await ensureNodeModules(root);

  const { tmp, env, cleanup } = await startThrowaway(root);
  // The S3 fake (s3rver, its own process) for the api-s3 project: tests/support/api-s3-global-setup.ts.
  const s3 = await startS3Fake(path.join(tmp, 's3'), ['arcbench-test']).catch(async (err) => {
    await cleanup();
    throw err;
  });
  env.S3_FAKE_ENDPOINT = s3.endpoint;
  const results = [];
  const step = async (name, cmd, args) => {
    log(`── ${name}`);
    const code = await runStatus(cmd, args, { cwd: root, env });
    results.push({ name, ok: code === 0 });
    return code === 0;
  };
  const report = path.join(tmp, 'vitest-report.json');
  try {
    // SKIP_TYPECHECK=1 / SKIP_BUILD=1 shorten a developer's focused run (`npm test -- tests/api/x.test.ts`); CI never sets them.
    if (!process.env.SKIP_TYPECHECK) await step('type-check (tsc --noEmit)', bin(root, 'tsc'), ['--noEmit', '-p', 'tsconfig.json']);
    // A lint error (house rules: feature boundaries, shared/ on its own, process.env only in server/config.ts) fails the run.
    if (!process.env.SKIP_LINT) await step('lint (eslint)', bin(root, 'eslint'), ['.', '--cache', '--cache-location', path.join(root, 'node_modules', '.cache', 'eslint/')]);
    if (!process.env.SKIP_BUILD) await step('client build (vite build)', bin(root, 'vite'), ['build', '--logLevel', 'warn', '--outDir', env.CLIENT_DIST, '--emptyOutDir']);
    await step('tests (vitest: unit, api, e2e)', bin(root, 'vitest'), [
      'run',
      '--reporter=default',
      '--reporter=json',
      `--outputFile=${report}`,
      ...extraArgs,
    ]);
    let counts = { passed: 0, failed: 0, skipped: 0 };
    if (existsSync(report)) {
      const json = JSON.parse(readFileSync(report, 'utf8'));
      counts = { passed: json.numPassedTests, failed: json.numFailedTests, skipped: json.numPendingTests + json.numTodoTests };
    }
    const failedSteps = results.filter((r) => !r.ok).map((r) => r.name);
    for (const r of results) log(`${r.ok ? 'ok  ' : 'FAIL'} ${r.name}`);
    if (counts.passed + counts.failed === 0) failedSteps.push('no test ran');
    process.stdout.write(`\ntests: ${counts.passed} passed, ${counts.failed} failed, ${counts.skipped} skipped\n`);
    process.exitCode = failedSteps.length === 0 && counts.failed === 0 ? 0 : 1;
    if (process.exitCode) log(`Failed: ${failedSteps.join(', ') || 'tests'}`);
  } finally {
    await s3.stop();
    await cleanup();
  }
}

main().catch(async (err) => {
  log(err.message);
  process.exit(1);
});
