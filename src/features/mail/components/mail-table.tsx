import { useMemo } from 'react';
import type { MailMessage } from '@shared/schemas/mail';
import { Badge } from '@/components/ui/badge';
import { DataTable, dataTableColumns, type ServerPagination } from '@/components/ui/data-table';
import { formatDateTime } from '@/lib/format';

const col = dataTableColumns<MailMessage>();

export interface MailTableProps {
  caption: string;
  messages: readonly MailMessage[];
  loading: boolean;
  pagination: ServerPagination;
  selectedId: string | null;
  onOpen: (messageId: string) => void;
  /** The team outbox shows the recipient; my own mail does not need to. */
  showRecipient: boolean;
}

export function MailTable({ caption, messages, loading, pagination, selectedId, onOpen, showRecipient }: MailTableProps) {
  const columns = useMemo(
    () =>
      col.columns([
        col.accessor('receivedAt', {
          header: 'Received',
          sortFn: 'datetime',
          cell: (info) => <span className="tabular-nums whitespace-nowrap text-ink-soft">{formatDateTime(info.getValue())}</span>,
        }),
        ...(showRecipient
          ? [col.accessor('to', { header: 'To', cell: (info) => <span className="whitespace-nowrap">{info.getValue()}</span> })]
          : [col.accessor('from', { header: 'From', cell: (info) => <span className="whitespace-nowrap">{info.getValue()}</span> })]),
        col.accessor('subject', {
          header: 'Subject',
          cell: (info) => (
            // The subject is the row's button: one tab stop per message, Enter opens it.
            <button type="button" onClick={() => onOpen(info.row.original.id)} className="text-left font-medium text-ink underline-offset-2 hover:underline">
              {info.getValue()}
            </button>
          ),
        }),
        col.accessor('kind', { header: 'Kind', cell: (info) => (info.getValue() ? <Badge>{info.getValue()}</Badge> : '—') }),
      ]),
    [showRecipient, onOpen],
  );
  return (
    <DataTable
      caption={caption}
      columns={columns}
      data={messages}
      getRowId={(m) => m.id}
      loading={loading}
      pagination={pagination}
      selectedRowId={selectedId ?? undefined}
      empty="No messages yet."
      filterPlaceholder="Filter this page…"
      dense
    />
  );
}
