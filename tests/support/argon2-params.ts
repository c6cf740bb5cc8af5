/**
 * Reads the algorithm and m, t, p from a PHC-format hash ($argon2id$v=19$m=…,t=…,p=…$salt$hash).
 * The parameter order differs between libraries, so they are parsed, not pattern-matched.
 */
export function argon2Params(hash: string): { algorithm: string; version: string; m: number; t: number; p: number } {
  const [, algorithm, version, params] = hash.split('$');
  const kv = Object.fromEntries(params.split(',').map((pair) => pair.split('=')));
  return { algorithm, version, m: Number(kv.m), t: Number(kv.t), p: Number(kv.p) };
}
