// The fit command run as a real subprocess (node with the tsx loader), for
// success and for each kind of bad input.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { syntheticMarks } from '../../tests/support/synthetic-shot';
import { dragKFromCd } from './flight';

const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
let dir: string;

function runFit(args: string[]): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/cli/fit.ts', ...args], { cwd: repoRoot });
    let stdout = '', stderr = '';
    child.stdout.on('data', (d) => { stdout += d; });
    child.stderr.on('data', (d) => { stderr += d; });
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout, stderr }));
  });
}

function write(name: string, text: string): string {
  const p = path.join(dir, name);
  fs.writeFileSync(p, text);
  return p;
}

beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'arcbench-fit-cli-'));
});
afterAll(() => {
  fs.rmSync(dir, { recursive: true, force: true });
});

const BALL = ['--mass-kg', '0.058', '--diameter-m', '0.065'];

// Concurrent: each case is a separate process start, mostly loader start-up time.
describe.concurrent('fit CLI as a subprocess', () => {
  it('prints one JSON object with the documented fields', async () => {
    const k = dragKFromCd(0.47, 0.065, 0.058, 1.2);
    const marks = syntheticMarks({ speedMps: 30, angleDeg: 40, dragK_perM: k, frameRateHz: 240, markCount: 100, noiseM: 0.002, seed: 3, x0M: 0.5, y0M: 1, firstMarkS: 0.02 });
    const csv = ['t_s,x_m,y_m', ...marks.map((m) => `${m.tS},${m.xM},${m.yM}`)].join('\n');
    const file = write('good.csv', csv);
    const r = await runFit([file, ...BALL, '--air-density-kgm3', '1.2', '--muzzle-x-m', '0', '--muzzle-y-m', '0.75']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    for (const key of ['launchSpeedMps', 'launchAngleDeg', 'dragK_perM', 'dragCoefficient', 'x0M', 'y0M', 'muzzleSpeedMps']) {
      expect(out[key], key).toEqual({ value: expect.any(Number), stdErr: expect.any(Number), ci95: [expect.any(Number), expect.any(Number)] });
    }
    expect(out.model).toBe('quadratic-drag');
    expect(out.dragVerdict).toMatch(/^drag resolved/);
    expect(typeof out.rmsResidualM).toBe('number');
    expect(out.dragCoefficient.ci95[0]).toBeLessThan(0.47);
    expect(out.dragCoefficient.ci95[1]).toBeGreaterThan(0.47);
  }, 60_000);

  const good = ['t_s,x_m,y_m', '0,0,1', '0.01,0.3,1.2', '0.02,0.6,1.39', '0.03,0.9,1.57', '0.04,1.2,1.74', '0.05,1.5,1.9'];
  it.each([
    ['missing column', 't_s,x_m\n0,0\n0.1,1\n', /missing the y_m column/],
    ['non-number', [...good, '0.06,abc,2'].join('\n'), /x_m is not a number/],
    ['fewer points than parameters', good.slice(0, 4).join('\n'), /at least 5 marks/],
    ['non-increasing time', [...good, '0.05,1.8,2.0'].join('\n'), /not after the previous mark/],
  ])('exits non-zero with one line on stderr: %s', async (label, text, message) => {
    const file = write(`${label.replace(/\W+/g, '-')}.csv`, text as string);
    const r = await runFit([file, ...BALL]);
    expect(r.code).not.toBe(0);
    expect(r.stdout).toBe('');
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(message as RegExp);
  }, 60_000);

  it('exits non-zero with one line on stderr: missing file', async () => {
    const r = await runFit([path.join(dir, 'does-not-exist.csv'), ...BALL]);
    expect(r.code).not.toBe(0);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/cannot read .*does-not-exist\.csv \(ENOENT\)/);
  }, 60_000);

  it('exits non-zero with one line on stderr: bad option', async () => {
    const r = await runFit([path.join(dir, 'x.csv'), '--mass-kg', '-1', '--diameter-m', '0.05']);
    expect(r.code).not.toBe(0);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/--mass-kg must be positive/);
  }, 60_000);
});
