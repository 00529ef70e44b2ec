import nodemailer, { type Transporter } from 'nodemailer';
import { OutboxMessage } from '../../models';

/** One e-mail, in plain text and HTML. */
export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface MailerOptions {
  from: string;
  /** Attempts per message, the first included. */
  attempts?: number;
  /** Wait before the n-th retry is `retryDelayMs · 4^(n-1)` (ms). */
  retryDelayMs?: number;
  /** Write each message sent into the outbox table ourselves (true for a real SMTP server; the catcher records its own). */
  recordSent: boolean;
}

const DEFAULT_ATTEMPTS = 4;
const DEFAULT_RETRY_DELAY_MS = 2000;

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms).unref());

/**
 * Sends mail in the background. The action that asked for a message never waits for it and
 * never fails because of it: a failed send is retried with growing pauses and logged.
 */
export class Mailer {
  private readonly pending = new Set<Promise<void>>();
  private readonly attempts: number;
  private readonly retryDelayMs: number;

  constructor(
    private readonly transport: Transporter,
    private readonly options: MailerOptions,
  ) {
    this.attempts = options.attempts ?? DEFAULT_ATTEMPTS;
    this.retryDelayMs = options.retryDelayMs ?? DEFAULT_RETRY_DELAY_MS;
  }

  /** Queues `message`; returns at once. */
  queue(message: MailMessage): void {
    const job = this.deliver(message).finally(() => this.pending.delete(job));
    this.pending.add(job);
  }

  /**
   * Sends `message` now, once, and resolves true when the mail server took it (false when it refused or
   * could not be reached; the failure is logged). For a record that must say "sent" only of a mail that went.
   */
  send(message: MailMessage): Promise<boolean> {
    const job = this.attempt(message).then(
      () => true,
      (err: unknown) => {
        console.error(`[arcwright] mail to ${message.to} ("${message.subject}") failed:`, (err as Error).message);
        return false;
      },
    );
    const tracked = job.then(() => undefined);
    this.pending.add(tracked);
    void tracked.finally(() => this.pending.delete(tracked));
    return job;
  }

  /** Resolves when every queued message has been sent or given up on. */
  async idle(): Promise<void> {
    while (this.pending.size) await Promise.all([...this.pending]);
  }

  close(): void {
    this.transport.close();
  }

  /** One try at sending `message`, recorded in the outbox when this mailer records its own. Throws on failure. */
  private async attempt(message: MailMessage): Promise<void> {
    const info = await this.transport.sendMail({ from: this.options.from, ...message });
    if (this.options.recordSent) {
      await OutboxMessage.create({
        ...message,
        from: this.options.from,
        messageId: info.messageId ?? null,
        via: 'smtp',
      });
    }
  }

  private async deliver(message: MailMessage): Promise<void> {
    for (let attempt = 1; attempt <= this.attempts; attempt++) {
      try {
        await this.attempt(message);
        return;
      } catch (err) {
        const last = attempt === this.attempts;
        console.error(
          `[arcwright] mail to ${message.to} ("${message.subject}") failed, attempt ${attempt}/${this.attempts}` +
            (last ? '; giving up' : '; will retry'),
          (err as Error).message,
        );
        if (!last) await sleep(this.retryDelayMs * 4 ** (attempt - 1));
      }
    }
  }
}

/** A mailer over SMTP at `url` (smtp:// or smtps://). */
export function smtpMailer(url: string, options: Omit<MailerOptions, 'recordSent'>): Mailer {
  return new Mailer(nodemailer.createTransport(url), { ...options, recordSent: true });
}

/**
 * A mailer to the local catcher on 127.0.0.1:`port`. The catcher offers no STARTTLS (the
 * certificate built into smtp-server has expired), so the client must not try it.
 */
export function catcherMailer(port: number, options: Omit<MailerOptions, 'recordSent'>): Mailer {
  const transport = nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
  return new Mailer(transport, { ...options, recordSent: false });
}
