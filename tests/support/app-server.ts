import { spawn } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

/**
 * Starts the real server (`tsx server/index.ts`) on a free loopback port with the
 * mail fake, waits for it to report ready over IPC, and returns its URL.
 * Used by the browser tests' global set-up and by the browser bench.
 */
export async function startAppServer(env: NodeJS.ProcessEnv = {}): Promise<{ url: string; stop: () => Promise<void> }> {
  const server = spawn(path.join(root, 'node_modules/.bin/tsx'), ['server/index.ts'], {
    cwd: root,
    env: { ...process.env, PORT: String(await freePort()), HOST: '127.0.0.1', SMTP_URL: '', ...env },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  let output = '';
  server.stdout?.on('data', (d) => (output += d));
  server.stderr?.on('data', (d) => (output += d));
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start in 60 s:\n${output}`)), 60_000);
    server.on('message', (msg: { ready?: boolean; url?: string }) => {
      if (msg.ready && msg.url) {
        clearTimeout(timer);
        resolve(msg.url);
      }
    });
    server.on('exit', (code) => reject(new Error(`server exited (${code}):\n${output}`)));
  });
  return {
    url,
    stop: async () => {
      if (server.exitCode === null) {
        server.kill('SIGTERM');
        await new Promise((r) => server.once('exit', r));
      }
    },
  };
}
