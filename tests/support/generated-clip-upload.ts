// Puts a freshly generated clip (known truth) on a new shot of the team,
// through the real API, and waits until its frames are extracted. Used by the
// workspace browser test and the workspace bench.
import { mkdtempSync, readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { APIRequestContext, APIResponse } from 'playwright-core';
import { generatePreset, type ClipPreset, type ClipSpec, type ClipTruth } from '../../server/fixtures/clip-generator';

const HEADERS = { 'X-Arcbench-Request': '1' };

export async function jsonOf<T>(res: APIResponse): Promise<T> {
  if (!res.ok()) throw new Error(`${res.url()} → ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

export async function demoTeamId(request: APIRequestContext, baseUrl: string): Promise<string> {
  const me = await jsonOf<{ teams: { id: string; name: string }[] }>(await request.get(`${baseUrl}/api/auth/me`));
  const team = me.teams.find((t) => t.name === 'Ollendry Line Works');
  if (!team) throw new Error('the signed-in person is not in the demo team');
  return team.id;
}

/** `request` must belong to a signed-in analyst or admin (uploading needs CAN.editShots). */
export async function uploadGeneratedClip(
  request: APIRequestContext,
  baseUrl: string,
  teamId: string,
  preset: ClipPreset = 'clean',
  overrides: Partial<ClipSpec> = {},
): Promise<{ clipId: string; truth: ClipTruth }> {
  const dir = mkdtempSync(path.join(process.env.ARCBENCH_TMP ?? os.tmpdir(), 'generated-clip-'));
  const generated = await generatePreset(preset, dir, overrides);
  const suffix = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
  const series = await jsonOf<{ id: string }>(
    await request.post(`${baseUrl}/api/teams/${teamId}/series`, { headers: HEADERS, data: { name: `Generated ${suffix}`, testDate: '2026-11-30' } }),
  );
  const shot = await jsonOf<{ id: string }>(
    await request.post(`${baseUrl}/api/teams/${teamId}/shots`, { headers: HEADERS, data: { seriesId: series.id, label: `Generated ${preset} ${suffix}` } }),
  );
  const clip = await jsonOf<{ id: string }>(
    await request.post(`${baseUrl}/api/teams/${teamId}/shots/${shot.id}/clips`, {
      headers: HEADERS,
      multipart: {
        captureFps: String(generated.truth.captureFps),
        file: { name: `${preset}-shot.mp4`, mimeType: 'video/mp4', buffer: readFileSync(generated.videoPath) },
      },
    }),
  );
  for (let i = 0; i < 240; i++) {
    const c = await jsonOf<{ status: string; error: string | null }>(await request.get(`${baseUrl}/api/teams/${teamId}/clips/${clip.id}`));
    if (c.status === 'ready') return { clipId: clip.id, truth: generated.truth };
    if (c.status === 'failed' || c.status === 'cancelled') throw new Error(`extraction ${c.status}: ${c.error}`);
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error('frame extraction did not finish in 2 minutes');
}
