import type { QueryClient, QueryKey } from '@tanstack/react-query';

/** Invalidates every view under each prefix, and settles when all have refetched. */
export async function invalidateAll(client: QueryClient, prefixes: readonly QueryKey[]): Promise<void> {
  await Promise.all(prefixes.map((queryKey) => client.invalidateQueries({ queryKey })));
}
