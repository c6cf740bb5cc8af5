// The local S3 fake (s3rver from npm) for tests, the bench and `npm run dev`.
// It runs in its own child process started with `node --openssl-legacy-provider`:
// s3rver hashes listings with an algorithm Node 20's OpenSSL 3 refuses, and
// listing more than 1000 keys would answer 500 inside an ordinary process.
// Run directly (`node --openssl-legacy-provider scripts/lib/s3-fake.mjs <dir> <bucket>…`)
// it serves on a free loopback port and tells its parent the port over IPC.
// Builtins only at the top: it is imported before `npm ci` may have run.
import { spawn } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const self = fileURLToPath(import.meta.url);

/** The settings every Arcbench process needs to talk to the fake (keys s3rver accepts). */
export function s3FakeEnv(endpoint, bucket, prefix = '') {
  return {
    STORAGE_URL: `s3://${bucket}/${prefix}`,
    S3_ENDPOINT: endpoint,
    S3_FORCE_PATH_STYLE: 'true',
    AWS_REGION: 'us-east-1',
    AWS_ACCESS_KEY_ID: 'S3RVER',
    AWS_SECRET_ACCESS_KEY: 'S3RVER',
  };
}

/**
 * Starts s3rver on 127.0.0.1 with its files in `dir` and the given buckets
 * (names of 3–63 characters). Resolves { endpoint, port, stop }.
 */
export function startS3Fake(dir, buckets, { port = 0 } = {}) {
  mkdirSync(dir, { recursive: true });
  const child = spawn(process.execPath, ['--openssl-legacy-provider', self, dir, String(port), ...buckets], {
    stdio: ['ignore', 'ignore', 'pipe', 'ipc'],
  });
  let stderr = '';
  child.stderr.on('data', (d) => (stderr += d));
  const stop = () =>
    new Promise((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolve();
      child.once('exit', () => resolve());
      child.kill('SIGTERM');
    });
  return new Promise((resolve, reject) => {
    child.once('message', (m) => {
      if (m?.port) resolve({ endpoint: `http://127.0.0.1:${m.port}`, port: m.port, pid: child.pid, stop });
      else reject(new Error(`the S3 fake did not start: ${JSON.stringify(m)}\n${stderr}`));
    });
    child.once('exit', (code) => reject(new Error(`the S3 fake exited (${code}) before it was ready:\n${stderr}`)));
  });
}

async function serve([dir, port, ...buckets]) {
  const { default: S3rver } = await import('s3rver');
  const server = new S3rver({
    address: '127.0.0.1',
    port: Number(port),
    directory: dir,
    silent: true,
    configureBuckets: buckets.map((name) => ({ name })),
  });
  const address = await server.run();
  process.send?.({ port: address.port });
  const stop = async () => {
    await server.close().catch(() => {});
    process.exit(0);
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
  // The parent went away without stopping us: do not linger.
  process.on('disconnect', stop);
}

if (process.argv[1] === self) {
  serve(process.argv.slice(2)).catch((err) => {
    process.send?.({ error: err.message });
    process.stderr.write(`${err.stack}\n`);
    process.exit(1);
  });
}
