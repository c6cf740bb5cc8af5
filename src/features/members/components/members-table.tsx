import { useMemo, useState } from 'react';
import { ROLE_LABELS } from '@shared/roles';
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
            return (
              <RoleSelect
                label={`Role of ${member.displayName}`}
                value={member.role}
                disabled={changeRole.isPending}
                onChange={(role) => {
                  setChanged(null);
                  changeRole.mutate(
                    { userId: member.userId, role },
                    { onSuccess: () => setChanged(`${member.displayName} is now ${ROLE_LABELS[role]}.`) },
                  );
                }}
              />
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
    [canManage, myUserId, changeRole],
  );

  return (
    <div className="flex flex-col gap-3">
      {changeRole.error ? <FormError error={changeRole.error} /> : changed && <InlineStatus tone="ok">{changed}</InlineStatus>}
      <DataTable caption="Members" columns={columns} data={members} getRowId={(m) => m.userId} loading={loading} empty="No members." filterPlaceholder="Filter by name, e-mail or role…" />
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
