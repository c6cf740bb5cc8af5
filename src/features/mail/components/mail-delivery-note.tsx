import { InlineStatus } from '@/components/ui/inline-status';

/** Says where mail goes, so an empty list is not mistaken for "nothing was sent". */
export function MailDeliveryNote({ fakeMail }: { fakeMail: boolean }) {
  return fakeMail ? (
    <InlineStatus>No SMTP server is configured, so Arcbench keeps every message here instead of sending it. Links in them work as sent.</InlineStatus>
  ) : (
    <InlineStatus>Mail goes out through the configured SMTP server and is not kept here; look in the recipients' mailboxes.</InlineStatus>
  );
}
