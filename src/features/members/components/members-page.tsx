import { CAN, ROLES, ROLE_DUTIES, ROLE_LABELS } from '@shared/roles';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useMe } from '@/api/me/get-me';
import { useInvitations } from '@/api/invitations/list-invitations';
import { useMembers } from '@/api/members/list-members';
import { InvitationsTable } from './invitations-table';
import { InviteForm } from './invite-form';
import { MembersTable } from './members-table';

export function MembersPage() {
  const { teamId, team, can } = useCurrentTeam();
  const { data: me } = useMe();
  const isAdmin = can(CAN.manageMembers);
  const members = useMembers(teamId);
  const invitations = useInvitations(teamId, isAdmin);

  return (
    <>
      <PageHeader
        eyebrow={team.name}
        title="Members"
        subtitle={isAdmin ? 'Change roles, remove people and invite new ones. A team always keeps at least one admin.' : 'Who is in the team and what each of them does.'}
      />
      <div className="grid gap-5 xl:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="flex min-w-0 flex-col gap-5">
          <FormError error={members.error} />
          <MembersTable
            teamId={teamId}
            teamName={team.name}
            members={members.data ?? []}
            loading={members.isPending}
            myUserId={me?.id ?? ''}
            canManage={isAdmin}
          />
          {isAdmin && (
            <Card title="Invitations" subtitle="Newest first. A waiting invitation can be revoked until it is used." flush className="overflow-hidden">
              <div className="p-3">
                <FormError error={invitations.error} />
                <InvitationsTable teamId={teamId} invitations={invitations.data ?? []} loading={invitations.isPending} />
              </div>
            </Card>
          )}
        </div>
        <div className="flex flex-col gap-5">
          {isAdmin && (
            <Card title="Invite someone" id="invite" subtitle="They get an e-mail with a link to join.">
              <InviteForm teamId={teamId} />
            </Card>
          )}
          <Card title="Roles">
            <dl className="flex flex-col gap-2.5">
              {ROLES.map((role) => (
                <div key={role}>
                  <dt className="text-body font-medium text-ink">{ROLE_LABELS[role]}</dt>
                  <dd className="text-micro text-ink-soft">{ROLE_DUTIES[role]}</dd>
                </div>
              ))}
            </dl>
          </Card>
        </div>
      </div>
    </>
  );
}
