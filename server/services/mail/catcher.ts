import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import { OutboxMessage } from '../../models';

export interface MailCatcher {
  port: number;
  close(): Promise<void>;
}

/** A message as the catcher received it, before anything is removed from it for the outbox. */
export interface CaughtMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface MailCatcherOptions {
  /** Called with each message as delivered (tests follow the links in it; nothing keeps it otherwise). */
  onDelivered?: (mail: CaughtMail) => void;
}

function addresses(field: AddressObject | AddressObject[] | undefined): string {
  if (!field) return '';
  return (Array.isArray(field) ? field : [field]).map((a) => a.text).join(', ');
}

/**
 * A local SMTP server on 127.0.0.1 (a free port) that keeps every message it receives in the
 * outbox table, so local use and tests need no real mail server. No auth, no STARTTLS.
 */
export function startMailCatcher(options: MailCatcherOptions = {}): Promise<MailCatcher> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    banner: 'Arcwright local mail catcher',
    size: 5 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const caught: CaughtMail = {
            to: addresses(mail.to),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : '',
          };
          options.onDelivered?.(caught);
          return OutboxMessage.create({
            ...caught,
            from: addresses(mail.from),
            messageId: mail.messageId ?? null,
            via: 'catcher',
          });
        })
        // Answer the client only once the row is written, so a resolved sendMail means "in the outbox".
        .then(
          () => callback(),
          (err: Error) => callback(err),
        );
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.server.address() as AddressInfo;
      resolve({ port, close: () => new Promise<void>((done) => server.close(() => done())) });
    });
  });
}
