import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { z } from 'zod';
import type { Db } from '../db/client';
import { mailMessages } from '../db/schema/mail-messages';

const uuid = z.uuid();

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(field) ? field : field ? [field] : [];
  return list.flatMap((a) => a.value.map((v) => (v.address ?? '').toLowerCase())).filter(Boolean);
}

/**
 * A local SMTP server on loopback standing in for a hosted mail service.
 * Each message is stored before the SMTP transaction is acknowledged, so
 * once sendMail() resolves the message is in the outbox.
 */
export async function startFakeSmtp(db: Db): Promise<{ url: string; close: () => Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Arcbench local outbox',
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const teamHeader = String(parsed.headers.get('x-arcbench-team') ?? '');
          const kind = parsed.headers.get('x-arcbench-kind');
          const from = addresses(parsed.from)[0] ?? 'unknown';
          const rows = addresses(parsed.to).map((to) => ({
            teamId: uuid.safeParse(teamHeader).success ? teamHeader : null,
            fromAddress: from,
            toAddress: to,
            subject: parsed.subject ?? '(no subject)',
            textBody: parsed.text ?? '',
            htmlBody: typeof parsed.html === 'string' ? parsed.html : null,
            kind: kind ? String(kind) : null,
          }));
          if (rows.length > 0) await db.insert(mailMessages).values(rows);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  const port = await new Promise<number>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve((server.server.address() as { port: number }).port));
  });
  return {
    url: `smtp://127.0.0.1:${port}`,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
