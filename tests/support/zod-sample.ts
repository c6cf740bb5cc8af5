// A plausible value for a zod (v4) schema, for tests that start from a body
// the route might accept and then break one field at a time. Reads zod's
// public definition objects (`schema._zod.def`); unknown kinds give a string.
import { randomUUID } from 'node:crypto';

type Def = { type: string; [k: string]: unknown };
type AnySchema = { _zod?: { def: Def } };

export function zodSample(schema: unknown, depth = 0): unknown {
  const def = (schema as AnySchema)?._zod?.def;
  if (!def || depth > 8) return 'x';
  const inner = (k: string) => zodSample(def[k], depth + 1);
  switch (def.type) {
    case 'object':
      return Object.fromEntries(Object.entries(def.shape as Record<string, unknown>).map(([k, v]) => [k, zodSample(v, depth + 1)]));
    case 'optional':
    case 'nullable':
    case 'default':
    case 'prefault':
    case 'readonly':
    case 'catch':
    case 'nonoptional':
    case 'success':
      return inner('innerType');
    case 'pipe':
      return inner('in');
    case 'lazy':
      return zodSample((def.getter as () => unknown)(), depth + 1);
    case 'string': {
      const format = String(def.format ?? '');
      if (format === 'email') return `fuzz.${randomUUID().slice(0, 8)}@example.test`;
      if (format === 'uuid' || format === 'guid') return randomUUID();
      if (format === 'datetime') return new Date().toISOString();
      if (format === 'date') return '2026-05-14';
      if (format === 'url') return 'https://example.test/';
      return 'fuzz text';
    }
    case 'number':
    case 'int':
    case 'bigint':
      return 1;
    case 'boolean':
      return true;
    case 'enum':
      return Object.values(def.entries as Record<string, unknown>)[0];
    case 'literal':
      return (def.values as unknown[])[0];
    case 'array':
      return [inner('element')];
    case 'tuple':
      return (def.items as unknown[]).map((i) => zodSample(i, depth + 1));
    case 'union':
      return zodSample((def.options as unknown[])[0], depth + 1);
    case 'intersection':
      return { ...(inner('left') as object), ...(inner('right') as object) };
    case 'record':
      return {};
    case 'date':
      return new Date().toISOString();
    case 'null':
      return null;
    default:
      return 'x';
  }
}

/** Paths to the leaves of a sample (arrays through their first element), at most `limit`. */
export function leafPaths(value: unknown, limit = 30, prefix: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = [];
  const walk = (v: unknown, p: (string | number)[]) => {
    if (out.length >= limit) return;
    if (Array.isArray(v)) {
      out.push(p); // the array itself
      if (v.length > 0) walk(v[0], [...p, 0]);
    } else if (v !== null && typeof v === 'object') {
      if (p.length > 0) out.push(p);
      for (const [k, child] of Object.entries(v)) walk(child, [...p, k]);
    } else out.push(p);
  };
  walk(value, prefix);
  return out;
}

/** A deep copy of `value` with the value at `path` replaced. */
export function withValue(value: unknown, path: (string | number)[], replacement: unknown): unknown {
  if (path.length === 0) return replacement;
  const copy = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<string | number, unknown>;
  copy[path[0]] = withValue(copy[path[0]], path.slice(1), replacement);
  return copy;
}
