import type { ServerConfig } from '../config';

/**
 * Every address the app hands to people (in mail and in API answers) is built here, on `config.publicUrl`,
 * read at the moment of use: it is settled only once the server listens (server/listen.ts).
 */

/** The read-only link of a shared sketch: the board at /shared/<token>. */
export function sharedSketchUrl(config: ServerConfig, token: string): string {
  return `${config.publicUrl}/shared/${encodeURIComponent(token)}`;
}

/** The page that takes a password-reset token. */
export function passwordResetUrl(config: ServerConfig, token: string): string {
  return `${config.publicUrl}/reset?token=${encodeURIComponent(token)}`;
}

/** The page that previews and accepts a class invitation. */
export function classInviteUrl(config: ServerConfig, token: string): string {
  return `${config.publicUrl}/invites/${encodeURIComponent(token)}`;
}

/** An assignment's page (instructions, copy, hand-ins and feedback). */
export function assignmentUrl(config: ServerConfig, assignmentId: number): string {
  return `${config.publicUrl}/assignments/${assignmentId}`;
}

/** The page that finishes a sign-up with the token mailed to the new address. */
export function signupConfirmUrl(config: ServerConfig, token: string): string {
  return `${config.publicUrl}/signup/confirm?token=${encodeURIComponent(token)}`;
}

/** The sign-in page. */
export function signInUrl(config: ServerConfig): string {
  return `${config.publicUrl}/signin`;
}

/** The page that asks for a password-reset mail. */
export function forgotPasswordUrl(config: ServerConfig): string {
  return `${config.publicUrl}/forgot`;
}

/** What stands in a logged mail for the token of a password-reset link. */
export const REMOVED_TOKEN = '(removed from the mail log)';

/**
 * `text` with the token of every password-reset link replaced by REMOVED_TOKEN: a mail kept for reading later
 * (the admin's mail log) must not hand anyone a working reset link. The token is base64url (see
 * services/password-reset.ts), so it ends at the first character outside that alphabet.
 */
export function withoutResetTokens(text: string): string {
  return text.replace(/(\/reset\?token=)[A-Za-z0-9_%-]+/g, `$1${REMOVED_TOKEN}`);
}
