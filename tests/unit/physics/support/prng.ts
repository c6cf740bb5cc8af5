// Small seeded generators for reproducible synthetic shots in tests.

// mulberry32 is the project's one seeded generator; the tests keep their own
// Box–Muller (with a spare) because their statistical checks are pinned to its sequence.
export { mulberry32 } from '../../../../shared/random/prng';

/** Standard normal deviates by the Box-Muller transform. */
export function gaussian(uniform: () => number): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) { const s = spare; spare = null; return s; }
    let u = 0;
    while (u === 0) u = uniform();
    const v = uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
}
