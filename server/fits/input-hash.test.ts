import { describe, expect, it } from 'vitest';
import { canonicalJson, inputHash } from './input-hash';

describe('input hash', () => {
  it('does not depend on key order, and changes with any number', () => {
    expect(canonicalJson({ b: 1, a: [1, { d: 2, c: 3 }] })).toBe('{"a":[1,{"c":3,"d":2}],"b":1}');
    expect(inputHash({ x: 1, y: 2 })).toBe(inputHash({ y: 2, x: 1 }));
    expect(inputHash({ x: 0.1 + 0.2 })).not.toBe(inputHash({ x: 0.3 }));
    // sha256("{}") is the published digest 44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a.
    expect(inputHash({})).toBe('44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a');
  });

  it('refuses numbers JSON cannot carry', () => {
    expect(() => canonicalJson({ x: Number.NaN })).toThrow();
  });
});
