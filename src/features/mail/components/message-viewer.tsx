import type { MailMessage } from '@shared/schemas/mail';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { KeyValueList } from '@/components/ui/key-value-list';
import { formatDateTime } from '@/lib/format';
import { LinkifiedText } from './linkified-text';

export function MessageViewer({ message, onClose }: { message: MailMessage; onClose: () => void }) {
  return (
    <article aria-labelledby="message-subject" className="rounded-card border border-line bg-paper-raised">
      <header className="flex items-start justify-between gap-3 border-b border-line px-4 py-3">
        <div className="min-w-0">
          <h2 id="message-subject" className="text-lead font-semibold text-ink">
            {message.subject}
          </h2>
          {message.kind && <Badge className="mt-1">{message.kind}</Badge>}
        </div>
        <Button size="sm" variant="ghost" onClick={onClose}>
          Close
        </Button>
      </header>
      <div className="border-b border-line px-4 py-2">
        <KeyValueList
          items={[
            { label: 'From', value: message.from },
            { label: 'To', value: message.to },
            { label: 'Received', value: formatDateTime(message.receivedAt), numeric: true },
          ]}
        />
      </div>
      <pre className="max-h-[32rem] overflow-auto px-4 py-3 font-sans text-body whitespace-pre-wrap text-ink">
        <LinkifiedText text={message.text} />
      </pre>
    </article>
  );
}
