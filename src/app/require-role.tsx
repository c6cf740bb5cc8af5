import type { ReactNode } from 'react';
import { ROLE_LABELS, type Role } from '@shared/roles';
import { ButtonLink } from '@/components/ui/button-link';
import { EmptyState } from '@/components/ui/empty-state';
import { useCurrentTeam } from '@/lib/use-current-team';

/** A team page only some roles may open; others see why instead of a broken page. */
export function RequireRole({ roles, children }: { roles: readonly Role[]; children: ReactNode }) {
  const { teamId, role, can } = useCurrentTeam();
  if (can(roles)) return <>{children}</>;
  return (
    <EmptyState title="This page is not part of your role" action={<ButtonLink to={`/t/${teamId}`}>Back to team home</ButtonLink>}>
      It needs {roles.map((r) => ROLE_LABELS[r]).join(' or ')}; you are {ROLE_LABELS[role]} in this team.
    </EmptyState>
  );
}
