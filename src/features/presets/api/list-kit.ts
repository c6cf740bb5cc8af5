import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Launcher, Projectile } from '@shared/schemas/records';
import { apiGet } from '@/lib/api-client';
import { presetKeys } from './keys';

// The presets area reads the team's kit for its own create form (features do not import each other).
export interface Kit {
  launchers: Launcher[];
  projectiles: Projectile[];
}

export async function fetchKit(teamId: string): Promise<Kit> {
  const [launchers, projectiles] = await Promise.all([
    apiGet<Launcher[]>(`/api/teams/${teamId}/launchers`),
    apiGet<Projectile[]>(`/api/teams/${teamId}/projectiles`),
  ]);
  return { launchers, projectiles };
}

export const kitQuery = (teamId: string) => queryOptions({ queryKey: [...presetKeys.all(teamId), 'kit'], queryFn: () => fetchKit(teamId) });

export const useKit = (teamId: string, enabled: boolean) => useQuery({ ...kitQuery(teamId), enabled });
