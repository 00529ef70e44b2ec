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
