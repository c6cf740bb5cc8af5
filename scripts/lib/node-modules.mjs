// Runs `npm ci` when node_modules is absent or was installed from another lock file.
// Several runs may start at once in one clone (parallel `npm test`s): one holds
// a lock folder and installs, the others wait and then find the stamp current.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { log, run } from './run.mjs';

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/**
 * npm's own record of what it installed (node_modules/.package-lock.json) lists
 * the same packages as package-lock.json: true after someone's `npm install x`,
 * which leaves our stamp stale but the tree right.
 */
export function installedMatchesLock(root) {
  try {
    const read = (file) => JSON.parse(readFileSync(file, 'utf8')).packages ?? {};
    const lock = read(path.join(root, 'package-lock.json'));
    const installed = read(path.join(root, 'node_modules', '.package-lock.json'));
    for (const [name, entry] of Object.entries(lock)) {
      if (name === '') continue;
      const got = installed[name];
      // Optional packages of other platforms are in the lock but never installed.
      if (!got) {
        if (entry.optional || entry.devOptional) continue;
        return false;
      }
      if (got.version !== entry.version) return false;
    }
    return Object.keys(installed).every((name) => name in lock);
  } catch {
    return false;
  }
}

function current(root, want) {
  const stamp = path.join(root, 'node_modules', '.arcbench-lock-sha256');
  const have = existsSync(stamp) ? readFileSync(stamp, 'utf8').trim() : '';
  if (!existsSync(path.join(root, 'node_modules', '.bin', 'tsx'))) return false;
  if (have === want) return true;
  if (!installedMatchesLock(root)) return false;
  writeFileSync(stamp, `${want}\n`);
  return true;
}

async function withInstallLock(root, fn) {
  const lock = path.join(root, '.npm-ci.lock');
  for (let waited = 0; ; waited += 1000) {
    try {
      mkdirSync(lock);
      break;
    } catch (err) {
      if (err.code !== 'EEXIST') throw err;
      // A lock older than 15 minutes belongs to a run that died.
      if (Date.now() - statSync(lock).mtimeMs > 15 * 60_000) rmSync(lock, { recursive: true, force: true });
      if (waited === 0) log('Another run is installing npm packages; waiting for it');
      await sleep(1000);
    }
  }
  try {
    return await fn();
  } finally {
    rmSync(lock, { recursive: true, force: true });
  }
}

export async function ensureNodeModules(root) {
  const lock = path.join(root, 'package-lock.json');
  const want = createHash('sha256').update(readFileSync(lock)).digest('hex');
  if (current(root, want)) return;
  await withInstallLock(root, async () => {
    if (current(root, want)) return;
    log(existsSync(path.join(root, 'node_modules')) ? 'package-lock.json changed: running npm ci' : 'Installing npm packages (npm ci)');
    await run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root });
    writeFileSync(path.join(root, 'node_modules', '.arcbench-lock-sha256'), `${want}\n`);
  });
}
