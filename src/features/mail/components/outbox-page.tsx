import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { useCurrentTeam } from '@/lib/use-current-team';
import { MAIL_PAGE_SIZE } from '@/api/mail/list-my-mail';
import { useTeamOutbox } from '@/api/outbox/list-team-outbox';
import { useMailLocation } from '../hooks/use-mail-location';
import { MailDeliveryNote } from './mail-delivery-note';
import { MailTable } from './mail-table';
import { MessageViewer } from './message-viewer';

/** Every e-mail sent on behalf of the team (invitations, notifications); admins only. */
export function OutboxPage() {
  const { teamId, team } = useCurrentTeam();
  const { page, messageId, setPage, open } = useMailLocation();
  const outbox = useTeamOutbox(teamId, page, MAIL_PAGE_SIZE);
  const selected = outbox.data?.items.find((m) => m.id === messageId) ?? null;

  return (
    <>
      <PageHeader eyebrow={team.name} title="Outbox" subtitle="Mail Arcbench sent for this team, newest first." />
      <div className="flex flex-col gap-4">
        {outbox.data && <MailDeliveryNote fakeMail={outbox.data.fakeMail} />}
        <FormError error={outbox.error} />
        <div className={selected ? 'grid items-start gap-5 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]' : undefined}>
          <MailTable
            caption="Team outbox"
            messages={outbox.data?.items ?? []}
            loading={outbox.isPending}
            pagination={{ page, pageSize: MAIL_PAGE_SIZE, total: outbox.data?.total ?? 0, onPageChange: setPage }}
            selectedId={messageId}
            onOpen={open}
            showRecipient
          />
          {selected && <MessageViewer message={selected} onClose={() => open(null)} />}
        </div>
        {messageId && outbox.data && !selected && (
          <Card>
            <p className="text-body text-ink-soft">That message is not on this page of the outbox.</p>
          </Card>
        )}
      </div>
    </>
  );
}
