// Small process helpers for the set-up scripts. Builtins only: these run
// before `npm ci` has installed anything.
import { spawn, spawnSync } from 'node:child_process';

export function log(message) {
  process.stdout.write(`[arcbench] ${message}\n`);
}

export function fail(message) {
  process.stderr.write(`[arcbench] ${message}\n`);
  process.exit(1);
}

export function isRoot() {
  return typeof process.getuid === 'function' && process.getuid() === 0;
}

/** Runs a command to completion, inheriting stdio; rejects on non-zero exit. */
export function run(cmd, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('exit', (code, signal) => {
      if (code === 0) resolve();
      else reject(new Error(`${cmd} ${args.join(' ')} exited with ${signal ?? code}`));
    });
  });
}

/** Runs a command and returns its exit code (never rejects on failure). */
export function runStatus(cmd, args, options = {}) {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: 'inherit', ...options });
    child.on('error', () => resolve(127));
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
  });
}

export function commandExists(cmd) {
  return spawnSync('sh', ['-c', `command -v ${cmd}`], { stdio: 'ignore' }).status === 0;
}

export function capture(cmd, args, options = {}) {
  const result = spawnSync(cmd, args, { encoding: 'utf8', ...options });
  return { status: result.status, stdout: result.stdout ?? '', stderr: result.stderr ?? '' };
}
