// A worker's scratch folder: clip downloads and frames on their way to the
// store. Its own folder, so sweeping it at start cannot touch another worker's
// work; a killed worker's leftovers go at the next start on that machine.
import { mkdir, readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { defaultScratchDir } from './create-storage';

export interface Scratch {
  dir: string;
  /** Removes the folder (on exit). */
  cleanup: () => Promise<void>;
}

/** Whether a process with this id still runs (EPERM: it runs, as another user). */
export function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * SCRATCH_DIR given: it is this worker's alone; emptied now. Not given: a
 * folder per process in the OS temp dir, and the folders of processes that
 * no longer run are removed.
 */
export async function prepareScratch(scratchDir: string | null): Promise<Scratch> {
  let dir: string;
  if (scratchDir) {
    dir = scratchDir;
    await rm(dir, { recursive: true, force: true });
  } else {
    dir = defaultScratchDir();
    for (const name of await readdir(os.tmpdir()).catch(() => [] as string[])) {
      const m = /^arcbench-scratch-(\d+)$/.exec(name);
      if (m && Number(m[1]) !== process.pid && !processAlive(Number(m[1]))) await rm(path.join(os.tmpdir(), name), { recursive: true, force: true });
    }
  }
  await mkdir(dir, { recursive: true });
  return { dir, cleanup: () => rm(dir, { recursive: true, force: true }) };
}
