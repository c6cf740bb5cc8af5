import { z } from 'zod';

export const Uuid = z.uuid({ error: 'must be an id (UUID)' });

/** The largest value a PostgreSQL integer (int4) column holds; whole numbers the client sends are bounded by it. */
export const INT4_MAX = 2_147_483_647;

/** A revision or version the client sends back: a whole number that fits an int4 column. */
export const WholeNumber = z.number().int('must be a whole number').min(0, 'must be 0 or more').max(INT4_MAX, `must be at most ${INT4_MAX}`);

export const TeamParams = z.object({ teamId: Uuid });

export const Email = z
  .email({ error: 'must be an e-mail address' })
  .max(254)
  .transform((value) => value.trim().toLowerCase());

export const DisplayName = z.string().trim().min(1, 'is required').max(80, 'must be at most 80 characters');

/** Length is the only rule, as NIST SP 800-63B recommends (no composition rules). */
export const NewPassword = z
  .string()
  .min(10, 'must be at least 10 characters')
  .max(256, 'must be at most 256 characters');

/** RFC 7807 problem document as the API sends it. */
export const Problem = z.object({
  type: z.string(),
  title: z.string(),
  status: z.number().int(),
  detail: z.string(),
  instance: z.string().optional(),
  errors: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
});
export type Problem = z.infer<typeof Problem>;

/** ?page&pageSize for long lists; query strings arrive as text, hence coerce. */
export const PageQuery = z.object({
  page: z.coerce.number().int().min(1, 'must be 1 or more').max(1_000_000, 'must be at most 1000000').default(1),
  pageSize: z.coerce.number().int().min(1, 'must be 1 or more').max(100, 'must be at most 100').default(20),
});
export type PageQuery = z.infer<typeof PageQuery>;
