/** Outgoing mail through nodemailer's SMTP transport. Routes only see `Mailer.send`. */
import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export interface MailerOptions {
  host: string;
  port: number;
  from: string;
  /** Plain SMTP without STARTTLS; only for the local fake server, which has no certificate. */
  plain?: boolean;
}

export function createMailer(options: MailerOptions): Mailer {
  const transport = nodemailer.createTransport({
    host: options.host,
    port: options.port,
    secure: false,
    ignoreTLS: options.plain ?? false,
    connectionTimeout: 10_000,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: options.from, to: mail.to, subject: mail.subject, text: mail.text });
    },
    close() {
      transport.close();
    },
  };
}
