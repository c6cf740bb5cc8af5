import { useEffect } from 'react';
import { Outlet, useParams } from 'react-router';
import { ButtonLink } from '@/components/ui/button-link';
import { EmptyState } from '@/components/ui/empty-state';
import { rememberTeam } from '@/lib/last-team';
import { useMembership } from '@/api/me/get-me';

/** Pages under /t/:teamId render only for members; useCurrentTeam() relies on this. */
export function TeamGate() {
  const { teamId } = useParams();
  const membership = useMembership(teamId);
  useEffect(() => {
    if (membership) rememberTeam(membership.id);
  }, [membership]);
  if (!membership) {
    return (
      <EmptyState title="You are not a member of this team" action={<ButtonLink to="/">Go to my teams</ButtonLink>}>
        The link may point to another team, or an admin removed you from it. Ask the team's admin to invite you.
      </EmptyState>
    );
  }
  return <Outlet />;
}
