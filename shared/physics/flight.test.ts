import { describe, expect, it } from 'vitest';
import { createRequire } from 'node:module';
import { flightDerivative, simulateTrajectory, PositionSampler } from './flight';
import { integrateDp45 } from './dp45';

// odex ships its TypeScript source next to the JS, and a static import would make
// tsc type-check that source (it does not pass strict mode). Load it at run time
// with a minimal local type instead.
interface OdexSolver {
  absoluteTolerance: number;
  relativeTolerance: number;
  maxSteps: number;
  solve(f: (x: number, y: number[]) => number[], x0: number, y0: number[], x1: number): { y: number[] };
}
const { Solver } = createRequire(import.meta.url)('odex') as { Solver: new (n: number) => OdexSolver };

const G = 9.80665;
const tight = { rtol: 1e-13, atol: 1e-13 };

describe('flight integrator against closed forms (standard mechanics, from memory)', () => {
  it('horizontal motion with quadratic drag, no gravity: x(t) = ln(1 + k v0 t) / k', () => {
    const k = 0.02, v0 = 60;
    const times = Array.from({ length: 41 }, (_, i) => i * 0.05);
    const traj = simulateTrajectory(
      { dragK_perM: k, gravityMps2: 0 }, { xM: 0, yM: 0, vxMps: v0, vyMps: 0 }, { timesS: times, ...tight },
    );
    expect(traj.points.length).toBe(times.length);
    for (const p of traj.points.slice(1)) {
      const x = Math.log(1 + k * v0 * p.tS) / k;
      const v = v0 / (1 + k * v0 * p.tS);
      expect(Math.abs(p.xM - x) / x).toBeLessThanOrEqual(1e-9);
      expect(Math.abs(p.vxMps - v) / v).toBeLessThanOrEqual(1e-9);
    }
  });

  it('fall from rest: v(t) = v_t tanh(g t / v_t), v_t = sqrt(g / k)', () => {
    const k = 0.01;
    const vt = Math.sqrt(G / k);
    const times = Array.from({ length: 31 }, (_, i) => i * 0.2);
    const traj = simulateTrajectory({ dragK_perM: k }, { xM: 0, yM: 100, vxMps: 0, vyMps: 0 }, { timesS: times, ...tight });
    for (const p of traj.points.slice(1)) {
      const v = -vt * Math.tanh((G * p.tS) / vt);
      const drop = ((vt * vt) / G) * Math.log(Math.cosh((G * p.tS) / vt));
      expect(Math.abs(p.vyMps - v) / Math.abs(v)).toBeLessThanOrEqual(1e-9);
      expect(Math.abs(100 - p.yM - drop) / drop).toBeLessThanOrEqual(1e-9);
    }
  });

  it('vacuum flight: range v0^2 sin(2 theta) / g, apex v0^2 sin^2(theta) / (2 g), located by the ground event', () => {
    const v0 = 30, th = (50 * Math.PI) / 180;
    const traj = simulateTrajectory(
      { dragK_perM: 0 },
      { xM: 0, yM: 0, vxMps: v0 * Math.cos(th), vyMps: v0 * Math.sin(th) },
      { stopAtHeightM: -1e-12, ...tight },
    );
    expect(traj.hitStopHeight).toBe(true);
    const range = (v0 * v0 * Math.sin(2 * th)) / G;
    expect(Math.abs(traj.end.xM - range) / range).toBeLessThanOrEqual(1e-9);
    const tFlight = (2 * v0 * Math.sin(th)) / G;
    expect(Math.abs(traj.endTS - tFlight) / tFlight).toBeLessThanOrEqual(1e-9);
    const apex = Math.max(...traj.points.map((p) => p.yM));
    expect(apex).toBeLessThanOrEqual((v0 * v0 * Math.sin(th) ** 2) / (2 * G) + 1e-9);
  });

  it('agrees with odex (Hairer ODEX, npm "odex") on a drag trajectory with wind to 1e-8 relative', () => {
    const model = { dragK_perM: 0.015, windXMps: -3 };
    const s0 = [0, 1.5, 25, 18];
    const tEnd = 2.5;
    const ours = integrateDp45(flightDerivative(model), 0, s0, tEnd, tight);
    const solver = new Solver(4);
    solver.absoluteTolerance = 1e-13;
    solver.relativeTolerance = 1e-13;
    solver.maxSteps = 100000;
    const f = flightDerivative(model);
    const theirs = solver.solve(
      (_t: number, y: number[]) => {
        const d = new Float64Array(4);
        f(_t, Float64Array.from(y), d);
        return Array.from(d);
      },
      0, s0, tEnd,
    );
    for (let i = 0; i < 4; i++) {
      expect(Math.abs(ours.yEnd[i] - theirs.y[i]) / Math.abs(theirs.y[i])).toBeLessThanOrEqual(1e-8);
    }
  });

  it('position sampler matches a fresh simulation and replays its own steps exactly', () => {
    const times = Float64Array.from({ length: 200 }, (_, i) => 0.1 + i / 480);
    const sampler = new PositionSampler(times);
    const xs = new Float64Array(200), ys = new Float64Array(200);
    const launch = { xM: 0.2, yM: 1, vxMps: 30, vyMps: 12 };
    const steps = sampler.sample({ dragK_perM: 0.01 }, launch, xs, ys)!;
    expect(steps.length).toBeGreaterThan(1);
    const ref = simulateTrajectory({ dragK_perM: 0.01 }, launch, { timesS: [0, ...Array.from(times, (t) => t - 0.1)] });
    // Sampler starts at times[0]; the reference starts at 0 with the same state, shifted by 0.1 s.
    for (let i = 0; i < 200; i += 37) expect(xs[i]).toBeCloseTo(ref.points[i + 1].xM, 8);
    const xr = new Float64Array(200), yr = new Float64Array(200);
    sampler.sample({ dragK_perM: 0.01 }, launch, xr, yr, steps);
    expect(Math.max(...Array.from(xr, (v, i) => Math.abs(v - xs[i])))).toBeLessThan(1e-12);
  });
});
