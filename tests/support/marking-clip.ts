// A clip row to calibrate and mark in API tests, without the upload and
// extraction pipeline (those have their own tests): records through the API,
// the clip and (optionally) its frame table written straight to the database.
import { eq } from 'drizzle-orm';
import type request from 'supertest';
import { expect } from 'vitest';
import { clipFrames, clips } from '../../server/db/schema/clips';
import { teams } from '../../server/db/schema/teams';
import { DEMO_TEAM } from '../../server/seed/demo-people';
import { uniqueSuffix, type TestApp } from './test-app';

export async function demoTeamId(t: TestApp): Promise<string> {
  const [team] = await t.deps.db.select({ id: teams.id }).from(teams).where(eq(teams.slug, DEMO_TEAM.slug));
  if (!team) throw new Error('the demo team is not seeded');
  return team.id;
}

export interface MarkingClipOptions {
  captureFps?: number;
  frameCount?: number;
  width?: number;
  height?: number;
  /** Frame times to store in clip_frames (frame number → seconds); none: times come from the capture rate. */
  frameTimes?: Map<number, number>;
  /** Storage keys of frame images, by frame number (for the snap route). */
  frameKeys?: Map<number, string>;
}

export async function createMarkingClip(t: TestApp, analyst: request.Agent, teamId: string, opts: MarkingClipOptions = {}): Promise<string> {
  const sfx = uniqueSuffix();
  const series = await analyst.post(`/api/teams/${teamId}/series`).send({ name: `Marking series ${sfx}`, testDate: '2026-06-01' });
  expect(series.status, JSON.stringify(series.body)).toBe(201);
  const shot = await analyst.post(`/api/teams/${teamId}/shots`).send({ seriesId: series.body.id, label: `Marking shot ${sfx}` });
  expect(shot.status, JSON.stringify(shot.body)).toBe(201);
  const captureFps = opts.captureFps ?? 1000;
  const frameCount = opts.frameCount ?? 200;
  const [clip] = await t.deps.db
    .insert(clips)
    .values({
      teamId,
      shotId: shot.body.id,
      originalName: `marking-${sfx}.mp4`,
      sha256: sfx.padEnd(64, '0'),
      sizeBytes: 1000,
      storageKey: `teams/${teamId}/clips/marking-${sfx}/original.mp4`,
      formatName: 'mov,mp4,m4a,3gp,3g2,mj2',
      codec: 'h264',
      width: opts.width ?? 640,
      height: opts.height ?? 480,
      containerFps: captureFps,
      captureFps,
      frameCount,
      durationS: frameCount / captureFps,
      inFrame: 0,
      outFrame: frameCount - 1,
      status: 'ready',
      progress: 1,
      extractedCount: frameCount,
    })
    .returning({ id: clips.id });
  const frameNumbers = new Set([...(opts.frameTimes?.keys() ?? []), ...(opts.frameKeys?.keys() ?? [])]);
  if (frameNumbers.size > 0) {
    await t.deps.db.insert(clipFrames).values(
      [...frameNumbers].map((n) => ({
        clipId: clip.id,
        frameNumber: n,
        tS: opts.frameTimes?.get(n) ?? n / captureFps,
        storageKey: opts.frameKeys?.get(n) ?? `teams/${teamId}/clips/${clip.id}/frames-1/${String(n).padStart(6, '0')}.jpg`,
        sizeBytes: 1000,
      })),
    );
  }
  return clip.id;
}

/** Scale 200 px per 1.000 m (±2 mm), origin (100, 300), level: these make hand-checked world coordinates easy. */
export const SIMPLE_CALIBRATION = {
  scale: { p1: { u: 100, v: 500 }, p2: { u: 300, v: 500 }, lengthM: 1, lengthTolM: 0.002, endpointSigmaPx: 0.5 },
  origin: { u: 100, v: 300 },
  level: { kind: 'angle', rollDeg: 0 },
} as const;
