import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WorkQueues } from '@shared/schemas/work-queues';
import { apiGet } from '@/lib/api-client';
import { teamPath } from '@/api/api-paths';
import { workQueueKeys } from '@/api/query-keys';

export const fetchWorkQueues = (teamId: string) => apiGet<WorkQueues>(teamPath(teamId, '/work-queues'));

// Every stage of the chain changes these counts; rather than every mutation knowing
// about the home, the home asks again each time it is shown.
export const workQueuesQuery = (teamId: string) =>
  queryOptions({ queryKey: workQueueKeys.all(teamId), queryFn: () => fetchWorkQueues(teamId), refetchOnMount: 'always' });

export const useWorkQueues = (teamId: string) => useQuery(workQueuesQuery(teamId));
