import { Navigate } from 'react-router';
import { NoTeamPage } from '@/features/teams/components/no-team-page';
import { lastTeamId } from '@/lib/last-team';
import { useMe } from '@/api/me/get-me';

/** "/" opens the team last worked in, else the first; people without a team can start one. */
export function HomeRedirect() {
  const { data: me } = useMe();
  if (!me) return null;
  const team = me.teams.find((t) => t.id === lastTeamId()) ?? me.teams[0];
  if (!team) return <NoTeamPage />;
  return <Navigate to={`/t/${team.id}`} replace />;
}
