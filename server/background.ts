import type { AppDeps } from './app-deps';

export interface Background {
  /** Extra dependencies the background services give route handlers (e.g. the job queue). */
  deps: Partial<AppDeps>;
  stop: () => Promise<void>;
}

/** Starts long-running services beside the HTTP server (the job worker, when it runs in-process). */
export async function startBackground(_deps: AppDeps): Promise<Background> {
  return { deps: {}, stop: async () => {} };
}
