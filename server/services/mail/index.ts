import type { ServerConfig } from '../../config';
import { startMailCatcher, type MailCatcher, type MailCatcherOptions } from './catcher';
import { catcherMailer, smtpMailer, type Mailer, type MailerOptions } from './mailer';

export interface MailSetup {
  mailer: Mailer;
  /** The local catcher, when SMTP_URL is not set. */
  catcher: MailCatcher | null;
  close(): Promise<void>;
}

/**
 * SMTP_URL when set; otherwise the in-process catcher that files every message in the outbox. The mailer
 * starts sending from the queue at once, mail left queued before a restart included.
 */
export async function setUpMail(
  config: ServerConfig,
  retry: Partial<Pick<MailerOptions, 'attempts' | 'retryDelayMs' | 'pollMs'>> = {},
  catcherOptions: MailCatcherOptions = {},
): Promise<MailSetup> {
  const options = { from: config.mailFrom, ...retry };
  if (config.smtpUrl) {
    const mailer = smtpMailer(config.smtpUrl, options);
    mailer.start();
    return { mailer, catcher: null, close: () => mailer.close() };
  }
  const catcher = await startMailCatcher(catcherOptions);
  const mailer = catcherMailer(catcher.port, options);
  mailer.start();
  return {
    mailer,
    catcher,
    async close() {
      await mailer.idle();
      await mailer.close();
      await catcher.close();
    },
  };
}
