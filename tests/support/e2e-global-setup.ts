import { execFileSync } from 'node:child_process';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { startAppServer } from './app-server';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

/** Starts the real server (built client, real database, mail fake) for the browser tests. */
export default async function setup(project: TestProject) {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run browser tests through `npm test`.');
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
  // All browser tests sign in from 127.0.0.1 against this one server; the
  // sign-in rate limit (tested in tests/api/auth-session.test.ts) would
  // otherwise lock later files out.
  const { url, stop } = await startAppServer({ DATABASE_URL: databaseUrl, SIGN_IN_LIMIT: '10000' });
  project.provide('baseUrl', url);
  return stop;
}
