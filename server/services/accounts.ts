import { Session, User, toPublicUser, type PublicUser } from '../models';
import { conflict } from '../middleware/http-error';
import { decoyHash, verifyPassword } from './passwords';

/** Creates a member account from a password already hashed. 409 when the e-mail is taken. */
export async function createAccount(input: { email: string; passwordHash: string; name: string }): Promise<PublicUser> {
  if (await User.findOne({ where: { email: input.email } })) {
    throw conflict('an account with this e-mail already exists');
  }
  const user = await User.create({
    email: input.email,
    name: input.name,
    role: 'member',
    passwordHash: input.passwordHash,
  });
  return toPublicUser(user);
}

/** What a sign-in attempt found: the account, or why there is none. */
export type CredentialCheck = { user: PublicUser } | { refused: 'wrong' | 'disabled' };

/**
 * The account for these credentials. Unknown e-mails are checked against a decoy hash so the answer
 * takes as long as for a real one. A disabled account is named as such only after its right password:
 * a wrong one gets the same answer as any wrong password, so being disabled tells a guesser nothing.
 */
export async function checkCredentials(email: string, password: string): Promise<CredentialCheck> {
  const user = await User.findOne({ where: { email } });
  if (!user) {
    await verifyPassword(password, await decoyHash());
    return { refused: 'wrong' };
  }
  if (!(await verifyPassword(password, user.passwordHash))) return { refused: 'wrong' };
  return user.disabled ? { refused: 'disabled' } : { user: toPublicUser(user) };
}

/** The account a session points at, or null when it is gone or disabled. */
export async function activeAccount(id: number): Promise<PublicUser | null> {
  const user = await User.findByPk(id);
  return user && !user.disabled ? toPublicUser(user) : null;
}

/** Ends every session of a user (disabled account, new password). Returns how many. */
export async function endSessionsOf(userId: number): Promise<number> {
  return Session.destroy({ where: { userId } });
}
