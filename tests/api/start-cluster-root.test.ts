// `npm start` as root from a clone in a private folder (issue: root's home and
// `mktemp -d` folders are 0700, which the `postgres` user cannot enter). The
// start script's cluster set-up runs from a copy of scripts/ placed in a fresh
// 0700 folder and in a fresh 0755 folder; each cluster must start, accept a
// connection, and be stopped and removed afterwards.
import { spawnSync } from 'node:child_process';
import { chmodSync, cpSync, existsSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';

const repoRoot = path.resolve(import.meta.dirname, '../..');
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
const cleanups: Array<() => void> = [];
afterAll(() => {
  for (const clean of cleanups.reverse()) clean();
});

type Started = { url: string; home: string; dataDir: string; where: string; remove: string };

/** Runs a snippet against the copied scripts/lib/pg-cluster.mjs in its own node process, as the start script does. */
function runClusterScript(clone: string, body: string, user?: string): string {
  const moduleUrl = pathToFileURL(path.join(clone, 'scripts/lib/pg-cluster.mjs')).href;
  const code = `const m = await import(${JSON.stringify(moduleUrl)}); const clone = ${JSON.stringify(clone)}; ${body}`;
  const cmd = user ? 'runuser' : process.execPath;
  const args = ['--input-type=module', '-e', code];
  const result = spawnSync(cmd, user ? ['-u', user, '--', process.execPath, ...args] : args, { cwd: clone, encoding: 'utf8', timeout: 120_000 });
  if (result.status !== 0) throw new Error(`cluster script failed (${result.status}): ${result.stderr}${result.stdout}`);
  return result.stdout.trim().split('\n').pop() ?? '';
}

/** A clone (just scripts/) inside a fresh folder of the given mode. */
function cloneIn(mode: number): string {
  const parent = mkdtempSync(path.join(os.tmpdir(), 'arcbench-clone-'));
  chmodSync(parent, mode);
  const clone = path.join(parent, 'arcbench');
  cpSync(path.join(repoRoot, 'scripts'), path.join(clone, 'scripts'), { recursive: true });
  cleanups.push(() => rmSync(parent, { recursive: true, force: true }));
  return clone;
}

function pgCtlStatus(dataDir: string): number | null {
  const binDir = spawnSync('sh', ['-c', 'ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1'], { encoding: 'utf8' }).stdout.trim();
  return spawnSync('runuser', ['-u', 'postgres', '--', path.join(binDir, 'pg_ctl'), '-D', dataDir, 'status'], { stdio: 'ignore' }).status;
}

describe.skipIf(!isRoot)('npm start as root: the cluster set-up from a clone in a private or open folder (skipped unless root; CI runs as root)', () => {
  for (const mode of [0o700, 0o755]) {
    it(`starts, connects, stops and removes a cluster for a clone in a ${mode.toString(8)} folder`, { timeout: 180_000 }, async () => {
      const clone = cloneIn(mode);
      expect(statSync(path.dirname(clone)).mode & 0o777).toBe(mode);

      const started = JSON.parse(
        runClusterScript(
          clone,
          `const c = await m.startCloneCluster(clone, { preferredPort: await m.freePort() });
           console.log(JSON.stringify({ url: c.url('postgres'), home: c.home, dataDir: c.dataDir, where: c.where, remove: c.remove }));`,
        ),
      ) as Started;
      cleanups.push(() => {
        if (existsSync(path.join(started.dataDir, 'postmaster.pid'))) runClusterScript(clone, 'await (await m.startCloneCluster(clone)).stop();');
        rmSync(started.home, { recursive: true, force: true });
      });

      // Root's cluster lives outside the clone, in a folder named after the clone's real path.
      expect(started.home.startsWith('/var/lib/arcbench/arcbench-')).toBe(true);
      expect(started.where).toBe(`PostgreSQL data: ${started.dataDir}`);
      expect(started.remove).toContain(`rm -rf ${started.home}`);
      expect(statSync(started.dataDir).uid).not.toBe(0); // owned by the postgres user, which PostgreSQL requires

      const client = new pg.Client({ connectionString: started.url });
      await client.connect();
      try {
        const { rows } = await client.query<{ user: string; dir: string }>(
          "select current_user as user, current_setting('data_directory') as dir",
        );
        expect(rows[0]).toEqual({ user: 'arcbench', dir: started.dataDir });
      } finally {
        await client.end();
      }

      // A second clone never shares the first one's cluster.
      const other = cloneIn(mode);
      const otherHome = runClusterScript(other, 'console.log(m.clusterHomeFor(clone));');
      expect(otherHome).not.toBe(started.home);

      runClusterScript(clone, 'await (await m.startCloneCluster(clone)).stop();');
      expect(pgCtlStatus(started.dataDir)).not.toBe(0);
      rmSync(started.home, { recursive: true, force: true });
      expect(existsSync(started.home)).toBe(false);
    });
  }

  it('keeps a non-root user in <clone>/.data, run as that user', () => {
    const clone = cloneIn(0o755);
    chmodSync(clone, 0o755);
    expect(runClusterScript(clone, 'console.log(m.clusterHomeFor(clone));', 'postgres')).toBe(path.join(clone, '.data'));
  });
});

describe('a PostgreSQL start failure is explained in one line with its fix', async () => {
  const { explainPgFailure } = (await import(pathToFileURL(path.join(repoRoot, 'scripts/lib/pg-cluster.mjs')).href)) as {
    explainPgFailure: (output: string, where: { home: string; dataDir: string; port: number; logFile: string | null }) => string;
  };
  const where = { home: '/h', dataDir: '/h/pg', port: 5432, logFile: '/h/pg/server.log' };
  // The left-hand messages are PostgreSQL's own wording (initdb, pg_ctl and the postmaster log).
  const cases: Array<[string, RegExp]> = [
    ['initdb: error: could not open file "/root/arcbench/.data/.pwfile" for reading: Permission denied', /cannot read or write|may not read or write.*Fix: make the path reachable/],
    ['FATAL:  database files are incompatible with server', /another PostgreSQL version.*Fix: remove \/h/],
    ['FATAL:  lock file "postmaster.pid" already exists', /already running.*Fix: stop it/],
    ['LOG:  could not bind IPv4 address "127.0.0.1": Address already in use', /port 5432.*is taken.*Fix:/],
    ['FATAL:  could not write lock file "postmaster.pid": No space left on device', /disk .* is full.*Fix: free/],
  ];
  for (const [output, expected] of cases) {
    it(output, () => {
      const line = explainPgFailure(output, where);
      expect(line).toMatch(expected);
      expect(line).not.toContain('\n');
    });
  }
});
