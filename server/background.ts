import type { AppDeps } from './app-deps';
import { startJobQueue } from './jobs/queue';
import { startDigestTimer } from './notifications/digest-timer';

export interface Background {
  /** Extra dependencies the background services give route handlers (e.g. the job queue). */
  deps: Partial<AppDeps>;
  stop: () => Promise<void>;
}

/**
 * Starts long-running services beside the HTTP server: the job queue always
 * (handlers enqueue), and its worker when it runs in-process
 * (IN_PROCESS_WORKER=false leaves the jobs to `npm run worker`).
 */
export async function startBackground(deps: AppDeps): Promise<Background> {
  const queue = await startJobQueue(deps.config, deps.db);
  if (deps.config.inProcessWorker) {
    await queue.startWorker({ db: deps.db, storage: deps.storage, config: deps.config, log: (line) => process.stdout.write(`${line}\n`) });
  }
  const stopDigests = startDigestTimer(deps);
  return {
    deps: { jobs: queue.jobs },
    stop: () => {
      stopDigests();
      return queue.stop();
    },
  };
}
