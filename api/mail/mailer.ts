/**
 * Outgoing mail through nodemailer. The transport comes from config.mail only:
 * the local sink (dev/test) or a real SMTP host (PULSEKEEPER_SMTP_HOST, _PORT,
 * _USER, _PASSWORD; port 465 means implicit TLS, others upgrade with STARTTLS).
 */
import nodemailer from 'nodemailer';
import type { Config } from '../config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export function createMailer(mail: Config['mail']): Mailer {
  const transport = nodemailer.createTransport({
    host: mail.host,
    port: mail.port,
    secure: mail.port === 465,
    ignoreTLS: mail.useLocalSink, // the loopback sink offers no TLS
    auth: mail.user ? { user: mail.user, pass: mail.password ?? '' } : undefined,
  });
  return {
    async send(message) {
      await transport.sendMail({ from: mail.from, ...message });
    },
    close() {
      transport.close();
    },
  };
}
