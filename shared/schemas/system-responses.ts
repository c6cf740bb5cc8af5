import { z } from 'zod';

// What the service routes answer (health, the API's own document), for the
// OpenAPI document and the contract check.

/** One dependency's state; the detailed check (?detail=1, admins) adds versions, latency and when ffmpeg was probed. */
const DependencyStatus = z.object({
  ok: z.boolean(),
  error: z.string().optional(),
  version: z.string().optional(),
  latencyMs: z.number().optional(),
  /** ISO 8601: when ffmpeg was last probed (detailed check only). */
  checkedAt: z.string().optional(),
});

export const HealthStatus = z.object({
  /** 200 with 'ok'; 503 with 'degraded' when a dependency fails. */
  status: z.enum(['ok', 'degraded']),
  database: DependencyStatus,
  ffmpeg: DependencyStatus,
});
export type HealthStatus = z.infer<typeof HealthStatus>;

/** The OpenAPI 3.1 document itself: only its outline is described here (the specification defines the rest). */
export const OpenApiDocumentShape = z
  .object({
    openapi: z.string().regex(/^3\.1\.\d+$/),
    info: z.object({ title: z.string(), version: z.string() }).loose(),
    paths: z.record(z.string(), z.record(z.string(), z.unknown())),
    components: z.record(z.string(), z.unknown()),
  })
  .loose();
