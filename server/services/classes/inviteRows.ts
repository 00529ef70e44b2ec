import { createHash, randomBytes } from 'node:crypto';
import type { ClassInvite } from '../../models';
import type { ClassInvite as ClassInviteRow, InviteState } from '../../../shared/schema/classes';

const TOKEN_BYTES = 32;

/** A new random token for an invitation link (43 URL-safe characters). */
export const newInviteToken = () => randomBytes(TOKEN_BYTES).toString('base64url');

/** What is stored of a token: a database copy gives nobody a working link. */
export const tokenHash = (token: string) => createHash('sha256').update(token).digest('hex');

/** Where an invitation stands now. A used or withdrawn one keeps that state after its expiry date. */
export function inviteState(invite: ClassInvite, now = Date.now()): InviteState {
  if (invite.acceptedAt) return 'accepted';
  if (invite.withdrawnAt) return 'withdrawn';
  if (invite.expiresAt.getTime() <= now) return 'expired';
  return 'pending';
}

/** An invitation as the roster shows it (only invitations whose mail went out are shown). */
export function inviteRowOf(invite: ClassInvite): ClassInviteRow {
  return {
    id: invite.id,
    email: invite.email,
    state: inviteState(invite),
    sentAt: (invite.sentAt ?? invite.createdAt).toISOString(),
    expiresAt: invite.expiresAt.toISOString(),
    acceptedAt: invite.acceptedAt ? invite.acceptedAt.toISOString() : null,
  };
}
