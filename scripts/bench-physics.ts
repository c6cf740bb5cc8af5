// Speed of the shot fits: median wall time and iterations of the quadratic-
// drag fit for 100, 500 and 2000 marks, next to the drag-free fit of the same
// marks as the in-process baseline. Goal: 500 marks <= 20 ms median.
// Run: npx tsx scripts/bench-physics.ts
import { pathToFileURL } from 'node:url';
import { fitDragFree } from '../shared/physics/drag-free-fit';
import { fitQuadraticDrag } from '../shared/physics/drag-fit';
import { fitShot } from '../shared/physics/fit-shot';
import { dragKFromCd, simulateTrajectory } from '../shared/physics/flight';
import type { Mark } from '../shared/physics/types';

const BALL = { massKg: 0.058, diameterM: 0.065, airDensityKgM3: 1.225 };
const TARGET_MS_500 = 20;

/** Seeded Gaussian noise (mulberry32 + Box-Muller) so every run fits the same marks. */
function noiseSource(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

function shotMarks(count: number, frameRateHz: number): Mark[] {
  const k = dragKFromCd(0.47, BALL.diameterM, BALL.massKg, BALL.airDensityKgM3);
  const th = (40 * Math.PI) / 180;
  const times = Array.from({ length: count }, (_, i) => i / frameRateHz);
  const traj = simulateTrajectory({ dragK_perM: k }, { xM: 0, yM: 1, vxMps: 30 * Math.cos(th), vyMps: 30 * Math.sin(th) }, { timesS: times });
  const noise = noiseSource(count);
  return traj.points.map((p) => ({ tS: p.tS, xM: p.xM + 0.002 * noise(), yM: p.yM + 0.002 * noise() }));
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

function timeIt(fn: () => void, repeats: number): number {
  const times: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  return median(times);
}

export async function benchPhysics(): Promise<string> {
  const cases: Array<[number, number]> = [[100, 240], [500, 1000], [2000, 1000]];
  const lines = [
    'marks  fps   drag fit ms  iterations  drag-free ms  ratio  fitShot ms',
  ];
  let ms500 = Number.NaN;
  for (const [count, fps] of cases) {
    const marks = shotMarks(count, fps);
    const typicalK = dragKFromCd(0.47, BALL.diameterM, BALL.massKg, BALL.airDensityKgM3);
    const start = fitDragFree(marks).state;
    const runDrag = () => fitQuadraticDrag(marks, { startState: start, typicalK_perM: typicalK });
    // Warm-up lets the JIT compile the hot paths before timing.
    for (let i = 0; i < 5; i++) { runDrag(); fitDragFree(marks); }
    const repeats = count >= 2000 ? 11 : 21;
    const dragMs = timeIt(runDrag, repeats);
    const iterations = runDrag().fit.iterations;
    const freeMs = timeIt(() => fitDragFree(marks), repeats);
    const shotMs = timeIt(() => fitShot({ marks, ...BALL }), Math.min(repeats, 11));
    if (count === 500) ms500 = dragMs;
    lines.push(
      `${String(count).padStart(5)}  ${String(fps).padStart(4)}  ${dragMs.toFixed(2).padStart(11)}  ${String(iterations).padStart(10)}  ` +
        `${freeMs.toFixed(2).padStart(12)}  ${(dragMs / freeMs).toFixed(1).padStart(5)}  ${shotMs.toFixed(2).padStart(10)}`,
    );
  }
  lines.push(
    `500-mark drag fit median ${ms500.toFixed(2)} ms; goal <= ${TARGET_MS_500} ms: ${ms500 <= TARGET_MS_500 ? 'met' : 'NOT met'} ` +
      '(wall time; other load on the machine inflates it).',
  );
  return lines.join('\n');
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  benchPhysics().then((text) => console.log(text));
}
