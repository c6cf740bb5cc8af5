// Speed of the shot fits: median wall time and iterations of the quadratic-
// drag fit for 100, 500 and 2000 marks, next to the drag-free fit of the same
// marks as the in-process baseline. Goal: 500 marks <= 20 ms median.
// Run: npx tsx scripts/bench-physics.ts
import { mulberry32, normalDeviates } from '../shared/random/prng';
import { pathToFileURL } from 'node:url';
import { fitDragFree } from '../shared/physics/drag-free-fit';
import { fitQuadraticDrag } from '../shared/physics/drag-fit';
import { fitShot } from '../shared/physics/fit-shot';
import { dragKFromCd, simulateTrajectory } from '../shared/physics/flight';
import type { FitMark } from '../shared/physics/types';

const BALL = { massKg: 0.058, diameterM: 0.065, airDensityKgM3: 1.225 };
const TARGET_MS_500 = 20;

function shotMarks(count: number, frameRateHz: number): FitMark[] {
  const k = dragKFromCd(0.47, BALL.diameterM, BALL.massKg, BALL.airDensityKgM3);
  const th = (40 * Math.PI) / 180;
  const times = Array.from({ length: count }, (_, i) => i / frameRateHz);
  const traj = simulateTrajectory({ dragK_perM: k }, { xM: 0, yM: 1, vxMps: 30 * Math.cos(th), vyMps: 30 * Math.sin(th) }, { timesS: times });
  const noise = normalDeviates(mulberry32(count));
  return traj.points.map((p) => ({ tS: p.tS, xM: p.xM + 0.002 * noise(), yM: p.yM + 0.002 * noise() }));
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Median wall time and median process CPU time (ms); CPU time is less disturbed by other load. */
function timeIt(fn: () => void, repeats: number): { wallMs: number; cpuMs: number } {
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    fn();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  return { wallMs: median(wall), cpuMs: median(cpu) };
}

export async function benchPhysics(): Promise<string> {
  const cases: Array<[number, number]> = [[100, 240], [500, 1000], [2000, 1000]];
  const lines = [
    'marks  fps  drag fit wall ms  cpu ms  iterations  drag-free wall ms  ratio  fitShot wall ms',
  ];
  let at500 = { wallMs: Number.NaN, cpuMs: Number.NaN };
  for (const [count, fps] of cases) {
    const marks = shotMarks(count, fps);
    const typicalK = dragKFromCd(0.47, BALL.diameterM, BALL.massKg, BALL.airDensityKgM3);
    const start = fitDragFree(marks).state;
    const runDrag = () => fitQuadraticDrag(marks, { startState: start, typicalK_perM: typicalK });
    // Warm-up lets the JIT compile the hot paths before timing.
    for (let i = 0; i < 5; i++) { runDrag(); fitDragFree(marks); }
    const repeats = count >= 2000 ? 11 : 21;
    const drag = timeIt(runDrag, repeats);
    const iterations = runDrag().fit.iterations;
    const free = timeIt(() => fitDragFree(marks), repeats);
    const shot = timeIt(() => fitShot({ marks, ...BALL }), Math.min(repeats, 11));
    if (count === 500) at500 = drag;
    lines.push(
      `${String(count).padStart(5)}  ${String(fps).padStart(4)}  ${drag.wallMs.toFixed(2).padStart(15)}  ${drag.cpuMs.toFixed(2).padStart(6)}  ` +
        `${String(iterations).padStart(10)}  ${free.wallMs.toFixed(2).padStart(17)}  ${(drag.wallMs / free.wallMs).toFixed(1).padStart(5)}  ` +
        `${shot.wallMs.toFixed(2).padStart(15)}`,
    );
  }
  const met = (ms: number) => (ms <= TARGET_MS_500 ? 'met' : 'NOT met');
  lines.push(
    `500-mark drag fit: median wall ${at500.wallMs.toFixed(2)} ms (${met(at500.wallMs)}), median CPU ${at500.cpuMs.toFixed(2)} ms ` +
      `(${met(at500.cpuMs)}); goal <= ${TARGET_MS_500} ms. Wall time includes any other load on the machine.`,
  );
  return lines.join('\n');
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  benchPhysics().then((text) => console.log(text));
}
