// Helpers for the clip API tests: a shot to hang clips on, uploads, polling,
// and a look at what is left on disk.
import { existsSync, mkdtempSync, readdirSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq, inArray } from 'drizzle-orm';
import type request from 'supertest';
import type { Db } from '../../server/db/client';
import { clips } from '../../server/db/schema/clips';
import { shots, testSeries } from '../../server/db/schema/records';
import { teams } from '../../server/db/schema/teams';
import { DEMO_TEAM } from '../../server/seed/demo-people';
import type { ClipView } from '../../shared/schemas/clips';
import { s3Run } from './api-s3-run';
import type { TestApp } from './test-app';

export async function demoTeamId(db: Db): Promise<string> {
  const [team] = await db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
  if (!team) throw new Error('the demo team is not seeded');
  return team.id;
}

/** A series and a shot of the team, straight in the database (the records API is tested on its own). */
export async function createShot(db: Db, teamId: string, suffix: string): Promise<string> {
  const [series] = await db
    .insert(testSeries)
    .values({ teamId, name: `Clip tests ${suffix}`, testDate: '2026-05-14', site: 'Wendlow Flats test field' })
    .returning({ id: testSeries.id });
  const [shot] = await db.insert(shots).values({ teamId, seriesId: series.id, label: `Shot ${suffix}` }).returning({ id: shots.id });
  return shot.id;
}

type Agent = ReturnType<typeof request.agent>;

export function uploadClip(
  agent: Agent,
  teamId: string,
  shotId: string,
  file: string | { buffer: Buffer; name: string },
  fields: Record<string, string | number> = { captureFps: 240 },
) {
  let req = agent.post(`/api/teams/${teamId}/shots/${shotId}/clips`).set('X-Arcbench-Request', '1');
  for (const [k, v] of Object.entries(fields)) req = req.field(k, String(v));
  return typeof file === 'string' ? req.attach('file', file) : req.attach('file', file.buffer, file.name);
}

/** Polls GET clip (as the UI does, about once a second) until `done` says so. */
export async function waitForClip(
  agent: Agent,
  teamId: string,
  clipId: string,
  done: (clip: ClipView) => boolean = (c) => ['ready', 'failed', 'cancelled'].includes(c.status),
  timeoutMs = 90_000,
): Promise<ClipView> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/teams/${teamId}/clips/${clipId}`);
    if (res.status !== 200) throw new Error(`GET clip: ${res.status} ${JSON.stringify(res.body)}`);
    if (done(res.body)) return res.body as ClipView;
    if (Date.now() > until) throw new Error(`clip ${clipId} still ${res.body.status} (progress ${res.body.progress}) after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

/** A fresh storage root for one test file, so its leftovers can be counted (in the S3 run: one that must stay empty). */
export function tempStorageDir(label: string): string {
  const s3 = s3Run();
  if (s3) return s3.newLocalStorageDir(`clips-${label}`);
  const base = process.env.ARCBENCH_TMP ?? os.tmpdir();
  return mkdtempSync(path.join(base, `clips-${label}-`));
}

/** Every stored object's key (whichever storage the app uses). */
export function storedKeys(t: TestApp): Promise<string[]> {
  return t.deps.storage.list('');
}

/** Extraction scratch files still present: under the storage's tmp/ on local disk, in the workers' own folders in the S3 run. */
export function scratchFiles(t: TestApp): string[] {
  const s3 = s3Run();
  if (!s3) return filesUnder(t.deps.config.storageDir).filter((f) => f.startsWith('tmp/extract/'));
  return s3.workerScratchDirs.flatMap((dir) => filesUnder(dir).filter((f) => f.startsWith('extract/')));
}

/**
 * Objects under the team's clips whose clip has no row: what a rejected or
 * broken upload would leave behind. Uploads of other test files that are
 * between storing and recording show up for a moment, so callers poll.
 */
export async function unownedClipKeys(t: TestApp, teamId: string): Promise<string[]> {
  const keys = await t.deps.storage.list(`teams/${teamId}/clips/`);
  const ids = [...new Set(keys.map((k) => k.split('/')[3]))];
  if (ids.length === 0) return [];
  const rows = await t.deps.db.select({ id: clips.id }).from(clips).where(inArray(clips.id, ids));
  const owned = new Set(rows.map((r) => r.id));
  return keys.filter((k) => !owned.has(k.split('/')[3]));
}

/** Every file under a folder (relative paths). */
export function filesUnder(dir: string): string[] {
  if (!existsSync(dir)) return [];
  const out: string[] = [];
  const walk = (d: string, rel: string) => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      const r = rel ? `${rel}/${e.name}` : e.name;
      if (e.isDirectory()) walk(path.join(d, e.name), r);
      else out.push(r);
    }
  };
  walk(dir, '');
  return out;
}

/** Frames rendered by the generator land here for one test file. */
export function fixtureDir(label: string): string {
  const base = process.env.ARCBENCH_TMP ?? os.tmpdir();
  return mkdtempSync(path.join(base, `clips-fixtures-${label}-`));
}
