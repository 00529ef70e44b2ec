import { createHash, randomBytes } from 'node:crypto';
import { Op } from 'sequelize';
import type { ServerConfig } from '../config';
import { PasswordReset, User } from '../models';
import { badRequest } from '../middleware/http-error';
import type { Mailer } from './mail/mailer';
import { passwordResetMail } from './mail/messages';
import { hashPassword } from './passwords';
import { endSessionsOf } from './accounts';
import { refuseWeakPassword } from './password-strength';

/** A reset link works this long (minutes). */
export const RESET_VALID_MINUTES = 60;
const TOKEN_BYTES = 32;

const sha256 = (token: string) => createHash('sha256').update(token).digest('hex');

/**
 * Mails a reset link when an active account has this e-mail; does nothing visible otherwise,
 * so the answer never tells whether an account exists.
 */
export async function requestPasswordReset(email: string, config: ServerConfig, mailer: Mailer): Promise<void> {
  const user = await User.findOne({ where: { email } });
  if (!user || user.disabled) return;
  const token = randomBytes(TOKEN_BYTES).toString('base64url');
  await PasswordReset.create({
    userId: user.id,
    tokenHash: sha256(token),
    expiresAt: new Date(Date.now() + RESET_VALID_MINUTES * 60_000),
  });
  await mailer.queue(passwordResetMail(config, user, token, RESET_VALID_MINUTES));
}

const refused = () =>
  badRequest('this reset link is not valid: it may have expired or been used already; ask for a new one');

/** Sets a new password with a reset token, once; every session of the account ends. */
export async function resetPassword(token: string, password: string): Promise<void> {
  const tokenHash = sha256(token);
  const found = await PasswordReset.findOne({ where: { tokenHash } });
  if (!found || found.usedAt || found.expiresAt.getTime() < Date.now()) throw refused();
  const holder = await User.findByPk(found.userId);
  if (!holder) throw refused();
  // Refused before the link is used up, so the person can try another password with the same link.
  await refuseWeakPassword(password, holder.email, holder.name);
  const passwordHash = await hashPassword(password);
  await PasswordReset.sequelize!.transaction(async (transaction) => {
    // Re-read under the write lock: of two concurrent uses of one token, only one wins.
    const reset = await PasswordReset.findOne({ where: { tokenHash, usedAt: null }, transaction });
    if (!reset || reset.expiresAt.getTime() < Date.now()) throw refused();
    const now = new Date();
    // Marked used only if still unused: where two uses read the row at once (a server database's
    // transactions run side by side), the second update changes nothing and that use is refused.
    const [claimed] = await PasswordReset.update(
      { usedAt: now },
      { where: { id: reset.id, usedAt: null }, transaction },
    );
    if (claimed !== 1) throw refused();
    // Other links still in someone's mailbox stop working too.
    await PasswordReset.update(
      { usedAt: now },
      { where: { userId: reset.userId, usedAt: null, id: { [Op.ne]: reset.id } }, transaction },
    );
    await User.update({ passwordHash }, { where: { id: reset.userId }, transaction });
  });
  await endSessionsOf(found.userId);
}
