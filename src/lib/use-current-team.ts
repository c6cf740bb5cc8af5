import { useParams } from 'react-router';
import type { Role } from '@shared/roles';
import { roleAllows } from '@shared/roles';
import { useMembership, type TeamMembership } from '@/api/me/get-me';

export interface CurrentTeam {
  teamId: string;
  team: TeamMembership;
  role: Role;
  /** roleAllows(role, CAN.x) for the current team, e.g. can(CAN.editShots). */
  can: (allowed: readonly Role[]) => boolean;
}

/**
 * The team in the URL (/t/:teamId/...) with my role in it. Only for pages
 * under the team route: the shell's team gate has already checked membership
 * and renders nothing below it otherwise, so this never returns undefined there.
 */
export function useCurrentTeam(): CurrentTeam {
  const { teamId } = useParams();
  const team = useMembership(teamId);
  if (!teamId || !team) throw new Error('useCurrentTeam() used outside a /t/:teamId page');
  return { teamId, team, role: team.role, can: (allowed) => roleAllows(team.role, allowed) };
}
