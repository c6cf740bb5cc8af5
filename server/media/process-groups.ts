// ffmpeg and ffprobe children die with the process that started them.
// Each runs in its own process group (detached), so one signal reaches
// everything ffmpeg may itself start, and a terminal's Ctrl-C reaches the
// server first, which then decides. Three ways a group is ended:
// - its own promise settles (normal case);
// - this process exits (process.exit, or returning from main): the 'exit' hook kills what is left;
// - this process is SIGKILLed (no hook runs): a small watchdog process sees its
//   stdin pipe close and kills every group still listed.
import { spawn, type ChildProcess, type SpawnOptions } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const live = new Set<number>();
let watchdog: ChildProcess | null = null;
let hooked = false;

function tellWatchdog(line: string) {
  if (!watchdog || watchdog.exitCode !== null || !watchdog.stdin?.writable) return;
  watchdog.stdin.write(`${line}\n`);
}

function startWatchdog() {
  if (watchdog && watchdog.exitCode === null) return;
  const script = fileURLToPath(new URL('./child-watchdog.mjs', import.meta.url));
  // A plain node (no loader flags), in a group of its own so Ctrl-C does not reach it.
  const child = spawn(process.execPath, [script], { detached: true, stdio: ['pipe', 'ignore', 'ignore'] });
  watchdog = child;
  child.on('error', () => (watchdog = null));
  // Neither the watchdog nor its pipe may keep this process alive.
  child.unref();
  (child.stdin as unknown as { unref?: () => void } | null)?.unref?.();
  child.stdin?.on('error', () => {});
  for (const pid of live) tellWatchdog(`+${pid}`);
}

function killGroup(pid: number, signal: NodeJS.Signals) {
  try {
    process.kill(-pid, signal);
  } catch {
    // the group is gone already
  }
}

function hookExit() {
  if (hooked) return;
  hooked = true;
  process.once('exit', () => {
    for (const pid of live) killGroup(pid, 'SIGKILL');
    live.clear();
    // The watchdog sees its pipe close and exits by itself.
  });
}

/** spawn() in a new process group that is killed when this process exits or dies. */
export function spawnInGroup(command: string, args: string[], options: SpawnOptions = {}): ChildProcess {
  hookExit();
  startWatchdog();
  const child = spawn(command, args, { ...options, detached: true });
  const pid = child.pid;
  if (pid) {
    live.add(pid);
    tellWatchdog(`+${pid}`);
    child.once('exit', () => {
      live.delete(pid);
      tellWatchdog(`-${pid}`);
    });
  }
  return child;
}

/** Kills a child's whole group (ffmpeg and anything it started). */
export function killChildGroup(child: ChildProcess, signal: NodeJS.Signals = 'SIGKILL') {
  if (child.pid && child.exitCode === null && child.signalCode === null) killGroup(child.pid, signal);
}

/** Process ids of the groups still running (for tests and the health check). */
export function liveGroups(): number[] {
  return [...live];
}

/** The watchdog's pid, if one runs (tests kill around it). */
export function watchdogPid(): number | null {
  return watchdog?.pid ?? null;
}
