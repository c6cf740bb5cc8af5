import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** Lets the outbox show a team's mail to its admins. */
  teamId?: string;
  /** What the message is about, e.g. 'invitation' or 'fit-review'. */
  kind?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export function createMailer(smtpUrl: string, from: string): Mailer {
  const transport = nodemailer.createTransport(smtpUrl);
  return {
    async send(mail) {
      await transport.sendMail({
        from,
        to: mail.to,
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
        headers: {
          ...(mail.teamId ? { 'X-Arcbench-Team': mail.teamId } : {}),
          ...(mail.kind ? { 'X-Arcbench-Kind': mail.kind } : {}),
        },
      });
    },
    close: () => transport.close(),
  };
}
