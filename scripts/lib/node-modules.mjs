// Runs `npm ci` when node_modules is absent or was installed from another lock file.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { log, run } from './run.mjs';

export async function ensureNodeModules(root) {
  const lock = path.join(root, 'package-lock.json');
  const stamp = path.join(root, 'node_modules', '.arcbench-lock-sha256');
  const want = createHash('sha256').update(readFileSync(lock)).digest('hex');
  const have = existsSync(stamp) ? readFileSync(stamp, 'utf8').trim() : '';
  if (have === want && existsSync(path.join(root, 'node_modules', '.bin', 'tsx'))) return;
  log(existsSync(path.join(root, 'node_modules')) ? 'package-lock.json changed: running npm ci' : 'Installing npm packages (npm ci)');
  await run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root });
  writeFileSync(stamp, `${want}\n`);
}
