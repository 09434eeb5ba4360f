/** Outgoing mail through nodemailer over SMTP: a real server by SMTP_URL, or the local fake. */
import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../../config';
import { HttpError } from '../../errors';
import { log } from '../../log';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** invitation, password-reset, receipt, refund: lets the outbox sort and filter. */
  kind: string;
  /** The teacher whose action sent it, so they see it in their outbox. */
  senderId?: number;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

function transportFor(smtpUrl: string): Transporter {
  const url = new URL(smtpUrl);
  const loopback = ['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname);
  return nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port) || (url.protocol === 'smtps:' ? 465 : 587),
    secure: url.protocol === 'smtps:',
    // The loopback fake speaks plain SMTP; anything else must upgrade to TLS.
    ignoreTLS: loopback && url.protocol === 'smtp:',
    requireTLS: !loopback && url.protocol === 'smtp:',
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    connectionTimeout: 10_000,
  });
}

export function createMailer(config: Config): Mailer {
  const transport = config.smtpUrl ? transportFor(config.smtpUrl) : null;
  return {
    async send(mail) {
      if (!transport) throw new HttpError(503, 'MAIL_OFF', 'Mail is not set up on this server, so nothing was sent. An organiser can set SMTP_URL.');
      try {
        await transport.sendMail({
          from: config.mailFrom,
          to: mail.to,
          subject: mail.subject,
          text: mail.text,
          html: mail.html,
          headers: { 'X-Rackside-Kind': mail.kind, ...(mail.senderId ? { 'X-Rackside-Sender': String(mail.senderId) } : {}) },
        });
      } catch (err) {
        log.error({ err }, 'Sending mail failed');
        throw new HttpError(502, 'MAIL_FAILED', 'The mail server did not take the message. Please try again in a minute.');
      }
    },
    close: () => transport?.close(),
  };
}
