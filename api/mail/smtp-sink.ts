/**
 * The local SMTP sink of the dev and test profiles: an in-process smtp-server
 * on a loopback address that stores every message in `captured_emails`
 * (admins read them at GET /api/outbox). Tests start it in beforeAll.
 */
import type { Knex } from 'knex';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { readMimeMessage } from './read-mime-message';

export interface SmtpSink {
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

export async function startSmtpSink(options: { knex: Knex; host: string; port: number }): Promise<SmtpSink> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', callback);
      stream.on('end', () => {
        const raw = Buffer.concat(chunks);
        const message = readMimeMessage(raw.toString('utf8'));
        const to = session.envelope.rcptTo.map((r) => r.address).join(', ');
        options
          .knex('captured_emails')
          .insert({
            to_addresses: to.slice(0, 2000),
            subject: message.subject.slice(0, 1000),
            text_body: message.text,
            html_body: message.html,
            raw_size_bytes: raw.length,
          })
          .then(() => callback(), (err: Error) => callback(err));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  const address = server.server.address() as AddressInfo;
  return {
    port: address.port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
