import nodemailer, { type Transporter } from 'nodemailer';
import { Op, literal } from 'sequelize';
import { MailQueueItem, OutboxMessage } from '../../models';

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
  /** Longest pause between two looks at the queue (ms): how soon mail queued by another instance, or left by a stopped one, goes. */
  pollMs?: number;
}

const DEFAULT_ATTEMPTS = 4;
const DEFAULT_RETRY_DELAY_MS = 2000;
const DEFAULT_POLL_MS = 5000;
/** A message claimed longer ago than this was left by an instance that stopped while sending it: it is queued again (ms). */
const STALE_CLAIM_MS = 10 * 60_000;
/** Messages looked at per pass over the queue. */
const BATCH = 20;

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms).unref());

/**
 * Sends mail in the background from the queue table (mail_queue), which every app instance on the database
 * shares: queued mail and its retries outlive a restart. The action that asked for a message waits only for
 * its row to be written, and never fails because of it: a failed send is retried with growing pauses and
 * logged. An instance sends a message only after claiming it with one UPDATE that only one can win, so no
 * message is sent twice; one left claimed by a stopped instance is sent again after STALE_CLAIM_MS.
 */
export class Mailer {
  private readonly attempts: number;
  private readonly retryDelayMs: number;
  private readonly pollMs: number;
  /** Rows being written by queue(), and mails being sent by send(). */
  private readonly writing = new Set<Promise<void>>();
  private draining: Promise<void> | null = null;
  private again = false;
  private timer: NodeJS.Timeout | null = null;
  private closed = false;

  constructor(
    private readonly transport: Transporter,
    private readonly options: MailerOptions,
  ) {
    this.attempts = options.attempts ?? DEFAULT_ATTEMPTS;
    this.retryDelayMs = options.retryDelayMs ?? DEFAULT_RETRY_DELAY_MS;
    this.pollMs = options.pollMs ?? DEFAULT_POLL_MS;
  }

  /** Puts `message` in the queue; resolves once its row is written (a failure to write it is logged, not thrown). */
  queue(message: MailMessage): Promise<void> {
    const job = MailQueueItem.create({ ...message, state: 'queued', nextAttemptAt: new Date() })
      .then(
        () => void this.kick(),
        (err: unknown) => console.error(`[arcwright] mail to ${message.to} could not be queued:`, err),
      )
      .finally(() => this.writing.delete(job));
    this.writing.add(job);
    return job;
  }

  /**
   * Sends `message` now, once, outside the queue, and resolves true when the mail server took it (false when
   * it refused or could not be reached; the failure is logged). For a record that must say "sent" only of a
   * mail that went (class invitations): a queued mail could still fail after the record was written.
   */
  send(message: MailMessage): Promise<boolean> {
    const job = (async () => {
      const info = await this.transport.sendMail({ from: this.options.from, ...message });
      if (this.options.recordSent) {
        await OutboxMessage.create({
          ...message,
          from: this.options.from,
          messageId: info.messageId ?? null,
          via: 'smtp',
        });
      }
    })().then(
      () => true,
      (err: unknown) => {
        console.error(`[arcwright] mail to ${message.to} ("${message.subject}") failed:`, (err as Error).message);
        return false;
      },
    );
    const tracked = job.then(() => undefined);
    this.writing.add(tracked);
    void tracked.finally(() => this.writing.delete(tracked));
    return job;
  }

  /** Starts sending: what is due now (left from before a restart too), then whatever comes due. */
  start(): void {
    void this.kick();
  }

  /** Resolves when no message is waiting in the queue any more: each sent or given up on (or the database is gone). */
  async idle(): Promise<void> {
    while (!this.closed) {
      while (this.writing.size) await Promise.all([...this.writing]);
      await this.kick();
      const next = await this.nextDue().catch((err: unknown) => {
        console.error('[arcwright] mail queue:', err);
        return null;
      });
      if (!next) return;
      await sleep(Math.max(0, next.getTime() - Date.now()));
    }
  }

  /** When the next queued message is due, if any is queued. */
  private async nextDue(): Promise<Date | null> {
    const next = await MailQueueItem.findOne({
      where: { state: 'queued' },
      attributes: ['nextAttemptAt'],
      order: [['nextAttemptAt', 'ASC']],
    });
    return next?.nextAttemptAt ?? null;
  }

  /** Stops sending once the message in hand is done; what is still queued stays for the next start. */
  async close(): Promise<void> {
    this.closed = true;
    if (this.timer) clearTimeout(this.timer);
    while (this.writing.size) await Promise.all([...this.writing]);
    await this.draining;
    this.transport.close();
  }

  /** Runs a pass over the queue unless one is running (which then runs once more). */
  private kick(): Promise<void> {
    if (this.closed) return Promise.resolve();
    if (this.draining) {
      this.again = true;
      return this.draining;
    }
    this.draining = (async () => {
      try {
        do {
          this.again = false;
          while (!this.closed && (await this.pass()) > 0);
        } while (this.again && !this.closed);
        await this.schedule();
      } catch (err) {
        console.error('[arcwright] mail queue:', err);
      }
    })().finally(() => {
      this.draining = null;
    });
    return this.draining;
  }

  /** Wakes up when the next retry is due, and at least every pollMs. */
  private async schedule(): Promise<void> {
    const next = await this.nextDue();
    if (this.closed) return;
    const wait = next ? Math.min(this.pollMs, Math.max(0, next.getTime() - Date.now())) : this.pollMs;
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.kick(), wait);
    this.timer.unref();
  }

  /** Claims and sends the messages due now; answers how many it claimed. */
  private async pass(): Promise<number> {
    const now = new Date();
    await MailQueueItem.update(
      { state: 'queued', nextAttemptAt: now },
      { where: { state: 'sending', claimedAt: { [Op.lt]: new Date(now.getTime() - STALE_CLAIM_MS) } } },
    );
    const due = await MailQueueItem.findAll({
      where: { state: 'queued', nextAttemptAt: { [Op.lte]: now } },
      attributes: ['id'],
      order: [['id', 'ASC']],
      limit: BATCH,
    });
    let claimed = 0;
    for (const { id } of due) {
      if (this.closed) break;
      if (!(await this.claim(id, now))) continue;
      claimed += 1;
      // Read again after the claim: another instance may have tried it since the list was read.
      const row = await MailQueueItem.findByPk(id);
      if (row) await this.deliver(row, row.attempts);
    }
    return claimed;
  }

  /** Takes the message for this instance: true for exactly one of the instances that try at once. */
  private async claim(id: number, now: Date): Promise<boolean> {
    const [changed] = await MailQueueItem.update(
      { state: 'sending', claimedAt: now, attempts: literal('"attempts" + 1') as unknown as number },
      { where: { id, state: 'queued', nextAttemptAt: { [Op.lte]: now } } },
    );
    return changed === 1;
  }

  private async deliver(row: MailQueueItem, attempt: number): Promise<void> {
    const message: MailMessage = { to: row.to, subject: row.subject, text: row.text, html: row.html };
    let messageId: string | null;
    try {
      const info = await this.transport.sendMail({ from: this.options.from, ...message });
      messageId = (info as { messageId?: string }).messageId ?? null;
    } catch (err) {
      const last = attempt >= this.attempts;
      console.error(
        `[arcwright] mail to ${message.to} ("${message.subject}") failed, attempt ${attempt}/${this.attempts}` +
          (last ? '; giving up' : '; will retry'),
        (err as Error).message,
      );
      const lastError = String((err as Error).message ?? err).slice(0, 1000);
      await MailQueueItem.update(
        last
          ? { state: 'failed', text: '', html: '', lastError }
          : {
              state: 'queued',
              nextAttemptAt: new Date(Date.now() + this.retryDelayMs * 4 ** (attempt - 1)),
              lastError,
            },
        { where: { id: row.id } },
      );
      return;
    }
    // Sent: the body (a reset link, say) leaves the queue; the outbox keeps the record of what went.
    await MailQueueItem.update({ state: 'sent', text: '', html: '', lastError: null }, { where: { id: row.id } });
    if (this.options.recordSent) {
      await OutboxMessage.create({ ...message, from: this.options.from, messageId, via: 'smtp' });
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
