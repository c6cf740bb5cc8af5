// At start-up: remove what a killed process left in the local clip store.
// - `*.partial-<pid>-<time>` files: uploads that were being streamed into the
//   store (local-disk.ts writes beside the target, then renames). One whose
//   writer no longer runs on this machine is dead; one older than a day is dead
//   whoever wrote it (a shared disk used by another machine).
// - `tmp/extract/<clipId>-*` folders: frames of an extraction that never moved
//   them into the store. Only when no extraction of that clip is alive (the
//   clip is not 'extracting' with a fresh heartbeat), so a worker process
//   sharing the store keeps its work. Their jobs need nothing here: the stale-job
//   check (jobs/queue.ts) hands a silent extraction back to the queue or fails it.
import { readdir, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { and, eq, gt, inArray, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';
import { processAlive } from './scratch';

const PARTIAL = /\.partial-(\d+)-(\d+)$/;
const DAY_MS = 24 * 3600 * 1000;

async function* walk(dir: string): AsyncGenerator<string> {
  let entries;
  try {
    entries = await readdir(dir, { withFileTypes: true });
  } catch {
    return;
  }
  for (const e of entries) {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) yield* walk(p);
    else yield p;
  }
}

export interface SweepResult {
  partialUploads: string[];
  extractionFolders: string[];
}

export async function sweepAbandoned(opts: { storageDir: string; db: Db; staleSeconds: number; now?: number }): Promise<SweepResult> {
  const now = opts.now ?? Date.now();
  const result: SweepResult = { partialUploads: [], extractionFolders: [] };
  for await (const file of walk(path.join(opts.storageDir, 'objects'))) {
    const m = PARTIAL.exec(file);
    if (!m) continue;
    const pid = Number(m[1]);
    const info = await stat(file).catch(() => null);
    const old = info !== null && now - info.mtimeMs > DAY_MS;
    if ((pid !== process.pid && !processAlive(pid)) || old) {
      await rm(file, { force: true });
      result.partialUploads.push(file);
    }
  }

  const extractRoot = path.join(opts.storageDir, 'tmp', 'extract');
  const folders = await readdir(extractRoot).catch(() => [] as string[]);
  const byClip = new Map<string, string[]>();
  for (const name of folders) {
    const clipId = name.slice(0, 36);
    if (!/^[0-9a-f-]{36}$/.test(clipId)) continue;
    byClip.set(clipId, [...(byClip.get(clipId) ?? []), name]);
  }
  if (byClip.size > 0) {
    const busy = new Set(
      (
        await opts.db
          .select({ id: clips.id })
          .from(clips)
          .where(
            and(
              inArray(clips.id, [...byClip.keys()]),
              eq(clips.status, 'extracting'),
              gt(clips.heartbeatAt, sql`now() - make_interval(secs => ${opts.staleSeconds})`),
            ),
          )
      ).map((r) => r.id),
    );
    for (const [clipId, names] of byClip) {
      if (busy.has(clipId)) continue;
      for (const name of names) {
        await rm(path.join(extractRoot, name), { recursive: true, force: true });
        result.extractionFolders.push(name);
      }
    }
  }
  return result;
}
