// Installs the Debian packages Arcbench needs when they are missing.
import { existsSync, readdirSync } from 'node:fs';
import { commandExists, isRoot, log, run } from './run.mjs';

/** Finds the newest PostgreSQL server bin folder Debian installed, if any. */
export function findPostgresBinDir() {
  const root = '/usr/lib/postgresql';
  if (existsSync(root)) {
    const versions = readdirSync(root)
      .filter((v) => existsSync(`${root}/${v}/bin/initdb`))
      .sort((a, b) => Number(b) - Number(a));
    if (versions.length > 0) return `${root}/${versions[0]}/bin`;
  }
  return commandExists('initdb') && commandExists('pg_ctl') ? '' : null;
}

const CHECKS = {
  postgresql: () => findPostgresBinDir() !== null,
  ffmpeg: () => commandExists('ffmpeg') && commandExists('ffprobe'),
  chromium: () => existsSync('/usr/bin/chromium'),
};

/** @param {Array<keyof typeof CHECKS>} names */
export async function ensureSystemPackages(names) {
  const missing = names.filter((name) => !CHECKS[name]());
  if (missing.length === 0) return;
  if (!isRoot()) {
    throw new Error(
      `Missing Debian packages: ${missing.join(', ')}. Install them as root with:\n` +
        `  sudo apt-get update && sudo apt-get install -y ${missing.join(' ')}\n` +
        'then run the command again.',
    );
  }
  log(`Installing Debian packages: ${missing.join(', ')} (apt-get; first run only)`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  await run('apt-get', ['update', '-qq'], { env });
  await run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...missing], { env });
  const still = missing.filter((name) => !CHECKS[name]());
  if (still.length > 0) throw new Error(`apt-get finished but these are still missing: ${still.join(', ')}`);
}
