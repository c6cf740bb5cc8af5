import { useMemo, useState } from 'react';
import { ROLE_LABELS } from '@shared/roles';
import type { Invitation, InvitationState } from '@shared/schemas/teams';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { DataTable, dataTableColumns } from '@/components/ui/data-table';
import { ConfirmDialog } from '@/components/ui/dialog';
import { FormError } from '@/components/ui/form-error';
import { formatDate } from '@/lib/format';
import { useRevokeInvitation } from '@/api/invitations/revoke-invitation';

const STATE_BADGES: Record<InvitationState, { tone: BadgeTone; label: string }> = {
  pending: { tone: 'signal', label: 'Waiting' },
  used: { tone: 'ok', label: 'Accepted' },
  expired: { tone: 'neutral', label: 'Expired' },
  revoked: { tone: 'alert', label: 'Revoked' },
};

const col = dataTableColumns<Invitation>();

export function InvitationsTable({ teamId, invitations, loading }: { teamId: string; invitations: readonly Invitation[]; loading: boolean }) {
  const revoke = useRevokeInvitation(teamId);
  const [revoking, setRevoking] = useState<Invitation | null>(null);

  const columns = useMemo(
    () =>
      col.columns([
        col.accessor('email', { header: 'E-mail', cell: (info) => <span className="font-medium text-ink">{info.getValue()}</span> }),
        col.accessor('role', { header: 'Role', cell: (info) => ROLE_LABELS[info.getValue()] }),
        col.accessor('state', {
          header: 'State',
          cell: (info) => {
            const badge = STATE_BADGES[info.getValue()];
            return <Badge tone={badge.tone}>{badge.label}</Badge>;
          },
        }),
        col.accessor('invitedBy', { header: 'Invited by', cell: (info) => info.getValue() ?? '—' }),
        col.accessor('expiresAt', { header: 'Valid until', sortFn: 'datetime', cell: (info) => <span className="tabular-nums">{formatDate(info.getValue())}</span> }),
        col.display({
          id: 'actions',
          header: '',
          meta: { srHeader: 'Actions', className: 'w-px text-right' },
          cell: (info) =>
            info.row.original.state === 'pending' ? (
              <Button size="sm" variant="ghost" onClick={() => setRevoking(info.row.original)}>
                Revoke<span className="sr-only"> invitation for {info.row.original.email}</span>
              </Button>
            ) : null,
        }),
      ]),
    [],
  );

  return (
    <>
      <DataTable caption="Invitations" columns={columns} data={invitations} getRowId={(i) => i.id} loading={loading} empty="No invitations sent yet." filterPlaceholder={false} dense />
      <ConfirmDialog
        open={revoking !== null}
        title={revoking ? `Revoke the invitation for ${revoking.email}?` : ''}
        description="The link in their e-mail stops working. You can invite them again later."
        confirmLabel="Revoke"
        busy={revoke.isPending}
        onClose={() => {
          setRevoking(null);
          revoke.reset();
        }}
        onConfirm={() => revoking && revoke.mutate(revoking.id, { onSuccess: () => setRevoking(null) })}
      >
        <FormError error={revoke.error} />
      </ConfirmDialog>
    </>
  );
}
