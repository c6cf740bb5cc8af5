import { FormError } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingBlock } from '@/components/ui/spinner';
import { useMe } from '@/api/me/get-me';
import { MAIL_PAGE_SIZE } from '@/api/mail/list-my-mail';
import { useMyMail } from '@/api/mail/list-my-mail';
import { useMyMessage } from '@/api/mail/get-my-message';
import { useMailLocation } from '../hooks/use-mail-location';
import { MailDeliveryNote } from './mail-delivery-note';
import { MailTable } from './mail-table';
import { MessageViewer } from './message-viewer';

/** Mail addressed to me, from every team. */
export function MyMailPage() {
  const { data: me } = useMe();
  const { page, messageId, setPage, open } = useMailLocation();
  const mail = useMyMail(page, MAIL_PAGE_SIZE);
  const onPage = mail.data?.items.find((m) => m.id === messageId) ?? null;
  // A linked message from another page is fetched on its own.
  const single = useMyMessage(messageId, !!mail.data && !onPage);
  const selected = onPage ?? single.data ?? null;

  return (
    <>
      <PageHeader title="My mail" subtitle={me ? `Messages Arcbench sent to ${me.email}, newest first.` : undefined} />
      <div className="flex flex-col gap-4">
        {mail.data && <MailDeliveryNote fakeMail={mail.data.fakeMail} />}
        <FormError error={mail.error ?? single.error} />
        <div className={selected ? 'grid items-start gap-5 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]' : undefined}>
          <MailTable
            caption="My mail"
            messages={mail.data?.items ?? []}
            loading={mail.isPending}
            pagination={{ page, pageSize: MAIL_PAGE_SIZE, total: mail.data?.total ?? 0, onPageChange: setPage }}
            selectedId={messageId}
            onOpen={open}
            showRecipient={false}
          />
          {selected && <MessageViewer message={selected} onClose={() => open(null)} />}
          {!selected && single.isFetching && <LoadingBlock label="Opening the message…" />}
        </div>
      </div>
    </>
  );
}
