import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { mkdtemp, rm, stat, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import { humidAirDensityKgM3 } from '../../shared/physics/air';
import { inspectClip } from '../clips/intake';
import { storeClip } from '../clips/store-clip';
import { loadConfig } from '../config';
import type { Db } from '../db/client';
import { clips } from '../db/schema/clips';
import { launchers, projectiles, shots, testSeries } from '../db/schema/records';
import { generateClip, presetSpec, type ClipSpec } from '../fixtures/clip-generator';
import { extractNow } from '../jobs/extract-frames';
import { createStorage } from '../storage/create-storage';
import { clipPrefix } from '../storage/storage';
import { DEMO_LAUNCHER_NAMES, DEMO_PROJECTILE_NAMES, DEMO_SERIES_NAME } from './demo-records';
import type { SeedStep } from './seed-demo';

// Three shots of the morning session, each with a rendered clip already
// extracted, so a fresh `npm start` has frames to mark. Keyed by shot label:
// a second start finds everything and renders nothing.

interface DemoShot {
  label: string;
  chamberPressurePa: number;
  elevationDeg: number;
  notes: string;
  clip: Partial<ClipSpec>;
}

// Foam line head 40: 55 g, 40 mm (demo-records.ts). A blunt cylinder flying
// end-on has a drag coefficient near 0.8 (Hoerner, Fluid-Dynamic Drag, from memory).
const FOAM_HEAD = { massKg: 0.055, diameterM: 0.04, dragCoefficient: 0.82 };
const DAY = { airTempC: 11, stationPressurePa: 101_300, relativeHumidityPct: 82 };
// The clips are rendered in the air of the day, so a fit can recover the drag coefficient.
const AIR_DENSITY_KG_M3 = humidAirDensityKgM3({ temperatureC: DAY.airTempC, pressurePa: DAY.stationPressurePa, relativeHumidity: DAY.relativeHumidityPct / 100 });
const SCENE: Partial<ClipSpec> = { ...FOAM_HEAD, airDensityKgM3: AIR_DENSITY_KG_M3, width: 640, height: 360, pixelsPerMetre: 90, originPx: { u: 60, v: 300 }, frameCount: 44 };

const DEMO_SHOTS: DemoShot[] = [
  { label: 'H-01', chamberPressurePa: 6.0e5, elevationDeg: 25, notes: 'First shot of the day; line bag not fitted.', clip: { launchSpeedMps: 24, launchAngleDeg: 25, seed: 101 } },
  { label: 'H-02', chamberPressurePa: 7.0e5, elevationDeg: 28, notes: 'Filmed on the phone in slow motion (plays at 30 fps).', clip: { launchSpeedMps: 27, launchAngleDeg: 28, containerFps: 30, seed: 102 } },
  { label: 'H-03', chamberPressurePa: 8.0e5, elevationDeg: 30, notes: 'Slight camera tilt on the tripod.', clip: { launchSpeedMps: 30, launchAngleDeg: 30, rollDeg: 1.5, blurSubframes: 5, seed: 103 } },
];

async function sha256Of(file: string): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of createReadStream(file)) hash.update(chunk as Buffer);
  return hash.digest('hex');
}

async function seedClips(db: Db, teamId: string): Promise<void> {
  const [series] = await db.select({ id: testSeries.id }).from(testSeries).where(and(eq(testSeries.teamId, teamId), eq(testSeries.name, DEMO_SERIES_NAME)));
  if (!series) throw new Error(`demo series "${DEMO_SERIES_NAME}" missing: the records step must run first`);
  const [launcher] = await db.select({ id: launchers.id }).from(launchers).where(and(eq(launchers.teamId, teamId), eq(launchers.name, DEMO_LAUNCHER_NAMES.lt40)));
  const [projectile] = await db
    .select({ id: projectiles.id })
    .from(projectiles)
    .where(and(eq(projectiles.teamId, teamId), eq(projectiles.name, DEMO_PROJECTILE_NAMES.foamHead40)));

  const config = loadConfig();
  const storage = createStorage(config);
  let scratch: string | null = null;
  try {
    for (const demo of DEMO_SHOTS) {
      const [existing] = await db.select({ id: shots.id }).from(shots).where(and(eq(shots.seriesId, series.id), eq(shots.label, demo.label)));
      const shotId =
        existing?.id ??
        (
          await db
            .insert(shots)
            .values({
              teamId,
              seriesId: series.id,
              launcherId: launcher?.id ?? null,
              projectileId: projectile?.id ?? null,
              label: demo.label,
              chamberPressurePa: demo.chamberPressurePa,
              elevationDeg: demo.elevationDeg,
              ...DAY,
              notes: demo.notes,
            })
            .returning({ id: shots.id })
        )[0].id;

      const [clip] = await db.select({ id: clips.id, status: clips.status }).from(clips).where(eq(clips.shotId, shotId)).limit(1);
      if (clip?.status === 'ready') continue;
      if (clip) {
        // A start that stopped half-way: the file is stored, only the frames are missing.
        await extractNow({ db, storage, config }, clip.id);
        continue;
      }
      scratch ??= await mkdtemp(path.join(os.tmpdir(), 'arcbench-demo-'));
      const spec = presetSpec('clean', { ...SCENE, ...demo.clip, name: `wendlow-${demo.label.toLowerCase()}` });
      const rendered = await generateClip(spec, scratch);
      const sizeBytes = (await stat(rendered.videoPath)).size;
      const name = path.basename(rendered.videoPath);
      const clipId = await storeClip(db, storage, {
        teamId,
        shotId,
        file: rendered.videoPath,
        facts: await inspectClip(rendered.videoPath, sizeBytes, name),
        originalName: name,
        sha256: await sha256Of(rendered.videoPath),
        sizeBytes,
        captureFps: spec.captureFps,
        inFrame: 0,
        outFrame: spec.frameCount - 1,
        createdBy: null,
      });
      // The truth beside the clip, for demo steps that seed marks from it.
      await writeFile(path.join(scratch, 'truth.json'), JSON.stringify(rendered.truth));
      await storage.putFile(`${clipPrefix(teamId, clipId)}truth.json`, path.join(scratch, 'truth.json'));
      await extractNow({ db, storage, config }, clipId);
    }
  } finally {
    if (scratch) await rm(scratch, { recursive: true, force: true });
  }
}

export const demoClipsStep: SeedStep = { name: 'shots and extracted clips', run: seedClips };
