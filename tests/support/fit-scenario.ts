// A shot from clip to marks through the real API: records, a generated clip
// with known truth (real ffmpeg), upload, extraction by the real job worker,
// calibration from the truth's scale points, and the truth marks plus seeded
// Gaussian pixel noise. Fit tests start from here.
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type request from 'supertest';
import { expect } from 'vitest';
import { generatePreset, type GeneratedClip } from '../../server/fixtures/clip-generator';
import { dryAirDensityKgM3 } from '../../shared/physics/air';
import { mulberry32, normalDeviates } from '../../shared/random/prng';
import { uniqueSuffix } from './test-app';

/**
 * A light 100 mm foam ball (50 g) at 25 m/s, 35°, Cd 0.47 (sphere, subcritical
 * Reynolds number: common handbook value), filmed at 240 fps for 90 frames.
 * Light on purpose: drag takes several m/s off in 0.37 s, so Cd is resolved
 * to a few per cent from 0.5 px marking noise.
 */
export const FIT_CLIP_OVERRIDES = { name: 'fit-ball', massKg: 0.05, frameCount: 90, seed: 21 } as const;

/** Dry air at 20 °C: the station pressure that makes the ideal-gas density exactly the clip's 1.2 kg/m³. */
export function conditionsForDensity(densityKgM3: number) {
  const airTempC = 20;
  const perPa = dryAirDensityKgM3(airTempC + 273.15, 1);
  return { airTempC, stationPressurePa: densityKgM3 / perPa, relativeHumidityPct: 0 };
}

export async function generateFitClip(): Promise<{ clip: GeneratedClip; cleanup: () => Promise<void> }> {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'arcbench-fit-clip-'));
  const clip = await generatePreset('clean', dir, { ...FIT_CLIP_OVERRIDES });
  return { clip, cleanup: () => rm(dir, { recursive: true, force: true }) };
}

export interface RecordsIds {
  seriesId: string;
  launcherId: string;
  projectileId: string;
  shotId: string;
}

/** Series, launcher, projectile and shot for the clip, named uniquely (test files share one database). */
export async function createShotRecords(a: request.Agent, teamId: string, truth: GeneratedClip['truth']): Promise<RecordsIds> {
  const sfx = uniqueSuffix();
  const ok = (res: request.Response) => {
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.id as string;
  };
  const seriesId = ok(await a.post(`/api/teams/${teamId}/series`).send({ name: `Fit series ${sfx}`, testDate: '2026-05-02' }));
  const launcherId = ok(
    await a.post(`/api/teams/${teamId}/launchers`).send({ name: `Fit launcher ${sfx}`, boreM: 0.1, barrelLengthM: 0.8, chamberVolumeM3: 0.004 }),
  );
  const projectileId = ok(await a.post(`/api/teams/${teamId}/projectiles`).send({ name: `Foam ball ${sfx}`, massKg: truth.massKg, diameterM: truth.diameterM }));
  const shotId = ok(
    await a.post(`/api/teams/${teamId}/shots`).send({
      seriesId,
      launcherId,
      projectileId,
      label: `Shot ${sfx}`,
      chamberPressurePa: 2e5,
      elevationDeg: truth.launchAngleDeg,
      ...conditionsForDensity(truth.airDensityKgM3),
    }),
  );
  return { seriesId, launcherId, projectileId, shotId };
}

/** Upload and wait for the worker to extract the frames (bounded polling; no timing is asserted). */
export async function uploadAndExtract(a: request.Agent, teamId: string, shotId: string, clip: GeneratedClip): Promise<string> {
  const up = await a.post(`/api/teams/${teamId}/shots/${shotId}/clips`).field('captureFps', String(clip.truth.captureFps)).attach('file', clip.videoPath);
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  const clipId: string = up.body.id ?? up.body.clip?.id;
  for (let i = 0; i < 600; i++) {
    const res = await a.get(`/api/teams/${teamId}/clips/${clipId}`);
    const status = res.body.status ?? res.body.clip?.status;
    if (status === 'ready') return clipId;
    if (status === 'failed' || status === 'cancelled') throw new Error(`extraction ${status}: ${JSON.stringify(res.body)}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('extraction did not finish');
}

/** Calibration from the truth file: its scale bar, launch point as origin, its level line. */
export async function calibrateFromTruth(a: request.Agent, teamId: string, clipId: string, truth: GeneratedClip['truth']) {
  const res = await a.post(`/api/teams/${teamId}/clips/${clipId}/calibrations`).send({
    scale: { p1: truth.scaleReference.p1, p2: truth.scaleReference.p2, lengthM: truth.scaleReference.lengthM, lengthTolM: 0.002, endpointSigmaPx: 0.5 },
    origin: truth.originPx,
    level: { kind: 'line', p1: truth.levelLine.p1, p2: truth.levelLine.p2 },
    downrange: 'right',
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as { id: string; version: number; pixelsPerMetre: number };
}

/** The truth marks with N(0, sigmaPx²) noise on u and v, seeded so every run places the same marks. */
export function noisyTruthMarks(truth: GeneratedClip['truth'], sigmaPx: number, seed: number) {
  const noise = normalDeviates(mulberry32(seed));
  return truth.frames.map((f) => ({ frameNumber: f.frameNumber, uPx: f.uPx + sigmaPx * noise(), vPx: f.vPx + sigmaPx * noise() }));
}

export async function createTrackWithMarks(a: request.Agent, teamId: string, clipId: string, marks: { frameNumber: number; uPx: number; vPx: number }[]) {
  const track = await a.post(`/api/teams/${teamId}/clips/${clipId}/tracks`).send({ name: 'Ball', kind: 'projectile' });
  expect(track.status, JSON.stringify(track.body)).toBe(201);
  const trackId: string = track.body.id;
  for (const m of marks) {
    const res = await a.put(`/api/teams/${teamId}/tracks/${trackId}/marks/${m.frameNumber}`).send({ uPx: m.uPx, vPx: m.vPx });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
  }
  return trackId;
}

export interface MarkedShot extends RecordsIds {
  clipId: string;
  trackId: string;
  calibrationId: string;
}

/** Everything up to a marked, calibrated track. */
export async function markedShot(a: request.Agent, teamId: string, clip: GeneratedClip, seed = 5): Promise<MarkedShot> {
  const records = await createShotRecords(a, teamId, clip.truth);
  const clipId = await uploadAndExtract(a, teamId, records.shotId, clip);
  const calibration = await calibrateFromTruth(a, teamId, clipId, clip.truth);
  const trackId = await createTrackWithMarks(a, teamId, clipId, noisyTruthMarks(clip.truth, 0.5, seed));
  return { ...records, clipId, trackId, calibrationId: calibration.id };
}
