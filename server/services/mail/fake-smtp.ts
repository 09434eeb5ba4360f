/**
 * The local stand-in for a mail server: a real SMTP server (smtp-server) on a loopback port that
 * parses every message it receives (mailparser) and keeps it in the Mail table, the outbox that
 * admins and teachers read. Nothing leaves the machine.
 */
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { Mail } from '../../db/models';

function addresses(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return '';
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ');
}

export interface FakeSmtp {
  port: number;
  /** What SMTP_URL would say to reach it. */
  url: string;
  close(): Promise<void>;
}

export async function startFakeSmtp(options: { maxBytes?: number } = {}): Promise<FakeSmtp> {
  const server = new SMTPServer({
    // Loopback only, plain text: no TLS upgrade and no sign-in to negotiate.
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    size: options.maxBytes ?? 2 * 1024 * 1024,
    logger: false,
    banner: 'Rackside local mail fake',
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const header = (name: string) => {
            const value = parsed.headers.get(name);
            return typeof value === 'string' ? value : null;
          };
          const sender = Number(header('x-rackside-sender'));
          await Mail.create({
            messageId: parsed.messageId ?? null,
            to: addresses(parsed.to),
            from: addresses(parsed.from),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            kind: header('x-rackside-kind'),
            senderId: Number.isInteger(sender) && sender > 0 ? sender : null,
            receivedAt: new Date(),
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return {
    port,
    url: `smtp://127.0.0.1:${port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
