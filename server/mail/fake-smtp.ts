/**
 * A local SMTP server for development and tests: accepts every message on 127.0.0.1, keeps it in
 * memory and reports it, so sign-up mail can be read without a real mail account.
 */
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';

export interface ReceivedMail {
  from: string;
  to: string[];
  subject: string;
  /** The whole message as received, headers and body. */
  raw: string;
}

export interface FakeSmtp {
  host: string;
  port: number;
  messages: ReceivedMail[];
  close(): Promise<void>;
}

/** Reads one header from a raw message, joining folded lines. */
function header(raw: string, name: string): string {
  const head = raw.split(/\r?\n\r?\n/, 1)[0] ?? '';
  const match = new RegExp(`^${name}:[ \\t]*(.*(?:\\r?\\n[ \\t].*)*)`, 'im').exec(head);
  return match ? match[1].replace(/\r?\n[ \t]+/g, ' ').trim() : '';
}

export async function startFakeSmtp(onMessage?: (mail: ReceivedMail) => void): Promise<FakeSmtp> {
  const messages: ReceivedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Leadbench fake mail',
    logger: false,
    size: 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        const mail: ReceivedMail = {
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: header(raw, 'Subject'),
          raw,
        };
        messages.push(mail);
        onMessage?.(mail);
        callback();
      });
    },
  });
  const host = '127.0.0.1';
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, host, () => resolve());
  });
  const { port } = server.server.address() as AddressInfo;
  let closing: Promise<void> | undefined;
  return {
    host,
    port,
    messages,
    close: () => (closing ??= new Promise<void>((resolve) => server.close(() => resolve()))),
  };
}
