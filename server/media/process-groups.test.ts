// ffmpeg's process group must not outlive the process that started it, whether
// that process exits normally or is SIGKILLed (then the watchdog acts).
import { spawn } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');

function groupAlive(pgid: number): boolean {
  try {
    process.kill(-pgid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

async function until(check: () => boolean, limitMs = 20_000): Promise<boolean> {
  for (const end = Date.now() + limitMs; Date.now() < end; await new Promise((r) => setTimeout(r, 100))) if (check()) return true;
  return check();
}

/** A parent process that starts a two-process group (sh and a sleeping grandchild) and reports its pgid. */
function startParent(then: 'wait' | 'exit') {
  const code = `
    import { spawnInGroup } from './server/media/process-groups.ts';
    const child = spawnInGroup('sh', ['-c', 'sleep 300 & sleep 300'], { stdio: 'ignore' });
    process.send({ pgid: child.pid });
    ${then === 'exit' ? 'setTimeout(() => process.exit(0), 200);' : 'setInterval(() => {}, 1000);'}
  `;
  const parent = spawn(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', code], { cwd: root, stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
  const pgid = new Promise<number>((resolve, reject) => {
    parent.once('message', (m: { pgid: number }) => resolve(m.pgid));
    parent.once('exit', (c) => reject(new Error(`parent exited (${c}) before reporting`)));
  });
  return { parent, pgid };
}

describe('ffmpeg process groups', () => {
  it('are killed by the watchdog when their parent is SIGKILLed', async () => {
    const { parent, pgid } = startParent('wait');
    const group = await pgid;
    expect(groupAlive(group)).toBe(true);
    parent.kill('SIGKILL');
    expect(await until(() => !groupAlive(group)), `process group ${group} still alive after its parent was SIGKILLed`).toBe(true);
  }, 60_000);

  it('are killed when their parent exits', async () => {
    const { parent, pgid } = startParent('exit');
    const group = await pgid;
    await new Promise((r) => parent.once('exit', r));
    expect(await until(() => !groupAlive(group)), `process group ${group} still alive after its parent exited`).toBe(true);
  }, 60_000);
});
