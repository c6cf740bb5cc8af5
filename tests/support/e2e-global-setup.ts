import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

let server: ChildProcess | null = null;

/** Starts the real server (built client, real database, mail fake) for the browser tests. */
export default async function setup(project: TestProject) {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run browser tests through `npm test`.');
  const port = await freePort();
  const root = path.resolve(import.meta.dirname, '../..');
  // The browser tests get a database of their own, freshly migrated and seeded,
  // so what the API tests leave behind (extra teams for the demo people, new
  // preset versions) cannot change where a sign-in lands or what a page shows.
  const dbUrl = new URL(process.env.DATABASE_URL);
  dbUrl.pathname = `${dbUrl.pathname}_e2e`;
  const databaseUrl = dbUrl.toString();
  execFileSync(path.join(root, 'node_modules/.bin/tsx'), ['server/cli/seed.ts'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: databaseUrl },
    stdio: 'inherit',
  });
  server = spawn(path.join(root, 'node_modules/.bin/tsx'), ['server/index.ts'], {
    cwd: root,
    // All browser tests sign in from 127.0.0.1 against this one server; the
    // sign-in rate limit (tested in tests/api/auth-session.test.ts) would
    // otherwise lock later files out.
    env: { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), HOST: '127.0.0.1', SMTP_URL: '', SIGN_IN_LIMIT: '10000' },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  let output = '';
  server.stdout?.on('data', (d) => (output += d));
  server.stderr?.on('data', (d) => (output += d));
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start in 60 s:\n${output}`)), 60_000);
    server!.on('message', (msg: { ready?: boolean; url?: string }) => {
      if (msg.ready && msg.url) {
        clearTimeout(timer);
        resolve(msg.url);
      }
    });
    server!.on('exit', (code) => reject(new Error(`server exited (${code}):\n${output}`)));
  });
  project.provide('baseUrl', url);
  return async () => {
    if (server && server.exitCode === null) {
      server.kill('SIGTERM');
      await new Promise((r) => server!.once('exit', r));
    }
  };
}
