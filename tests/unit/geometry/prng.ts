import { mulberry32 } from '../../../shared/random/prng';

/** The project's seeded generator (mulberry32), so statistical checks are repeatable. */
export const seededRandom = mulberry32;

/** Standard normal by Box–Muller. */
export function gaussian(rand: () => number): number {
  const u = 1 - rand();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rand());
}
