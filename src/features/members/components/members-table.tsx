import { useCallback, useMemo, useState } from 'react';
import { ROLE_LABELS, type Role } from '@shared/roles';
import type { Member } from '@shared/schemas/teams';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { DataTable, dataTableColumns } from '@/components/ui/data-table';
import { ConfirmDialog } from '@/components/ui/dialog';
import { FormError } from '@/components/ui/form-error';
import { InlineStatus } from '@/components/ui/inline-status';
import { formatDate } from '@/lib/format';
import { useChangeMemberRole } from '@/api/members/change-member-role';
import { useRemoveMember } from '@/api/members/remove-member';
import { RoleSelect } from './role-select';

export interface MembersTableProps {
  teamId: string;
  teamName: string;
  members: readonly Member[];
  loading: boolean;
  myUserId: string;
  /** Admins get the role select and the remove button. */
  canManage: boolean;
}

const col = dataTableColumns<Member>();

export function MembersTable({ teamId, teamName, members, loading, myUserId, canManage }: MembersTableProps) {
  const changeRole = useChangeMemberRole(teamId);
  const remove = useRemoveMember(teamId);
  const [removing, setRemoving] = useState<Member | null>(null);
  const [changed, setChanged] = useState<string | null>(null);
  // Making someone an admin hands them the whole team: it waits for a confirmation.
  const [promoting, setPromoting] = useState<Member | null>(null);
  const adminCount = members.filter((m) => m.role === 'admin').length;
  const applyRole = useCallback((member: Member, role: Role) => {
    setChanged(null);
    changeRole.mutate(
      { userId: member.userId, role },
      {
        onSuccess: () => {
          setChanged(`${member.displayName} is now ${ROLE_LABELS[role]}.`);
          setPromoting(null);
        },
      },
    );
  }, [changeRole]);

  const columns = useMemo(
    () =>
      col.columns([
        col.accessor('displayName', {
          header: 'Name',
          cell: (info) => (
            <span className="font-medium text-ink">
              {info.getValue()}
              {info.row.original.userId === myUserId && (
                <Badge className="ml-2" tone="neutral">
                  you
                </Badge>
              )}
            </span>
          ),
        }),
        col.accessor('email', { header: 'E-mail', cell: (info) => <span className="text-ink-soft">{info.getValue()}</span> }),
        col.accessor('role', {
          header: 'Role',
          cell: (info) => {
            const member = info.row.original;
            if (!canManage) return <Badge tone={member.role === 'admin' ? 'signal' : 'neutral'}>{ROLE_LABELS[member.role]}</Badge>;
            // A team always keeps an admin: the only one cannot change their own role (the server refuses it too).
            const onlyAdmin = member.role === 'admin' && adminCount === 1;
            const reasonId = `only-admin-${member.userId}`;
            return (
              <div className="flex flex-col gap-0.5">
                <RoleSelect
                  label={`Role of ${member.displayName}`}
                  value={member.role}
                  disabled={changeRole.isPending || onlyAdmin}
                  describedBy={onlyAdmin ? reasonId : undefined}
                  onChange={(role) => (role === 'admin' ? setPromoting(member) : applyRole(member, role))}
                />
                {onlyAdmin && (
                  <span id={reasonId} className="text-micro text-ink-faint">
                    The team’s only admin. Make someone else admin first.
                  </span>
                )}
              </div>
            );
          },
        }),
        col.accessor('joinedAt', { header: 'Joined', sortFn: 'datetime', cell: (info) => <span className="tabular-nums">{formatDate(info.getValue())}</span> }),
        ...(canManage
          ? [
              col.display({
                id: 'actions',
                header: '',
                meta: { srHeader: 'Actions', className: 'w-px text-right' },
                cell: (info) => (
                  <Button size="sm" variant="ghost" onClick={() => setRemoving(info.row.original)}>
                    Remove<span className="sr-only"> {info.row.original.displayName}</span>
                  </Button>
                ),
              }),
            ]
          : []),
      ]),
    [canManage, myUserId, changeRole, applyRole, adminCount],
  );

  return (
    <div className="flex flex-col gap-3">
      {changeRole.error ? <FormError error={changeRole.error} /> : changed && <InlineStatus tone="ok">{changed}</InlineStatus>}
      <DataTable caption="Members" columns={columns} data={members} getRowId={(m) => m.userId} loading={loading} empty="No members." filterPlaceholder="Filter by name, e-mail or role…" />
      <ConfirmDialog
        open={promoting !== null}
        title={promoting ? `Make ${promoting.displayName} an admin of ${teamName}?` : ''}
        description="Admins can invite and remove people, change anyone’s role and change the team’s settings."
        confirmLabel="Make admin"
        tone="primary"
        busy={changeRole.isPending}
        onClose={() => setPromoting(null)}
        onConfirm={() => promoting && applyRole(promoting, 'admin')}
      />
      <ConfirmDialog
        open={removing !== null}
        title={removing ? `Remove ${removing.displayName} from ${teamName}?` : ''}
        description={
          removing?.userId === myUserId
            ? 'You are removing yourself: you will lose access to this team at once.'
            : 'They lose access to the team at once. You can invite them again later.'
        }
        confirmLabel="Remove"
        busy={remove.isPending}
        onClose={() => {
          setRemoving(null);
          remove.reset();
        }}
        onConfirm={() => removing && remove.mutate(removing.userId, { onSuccess: () => setRemoving(null) })}
      >
        <FormError error={remove.error} />
      </ConfirmDialog>
    </div>
  );
}
