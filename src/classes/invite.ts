/** What an invitation's page says when its link no longer lets anyone join. Pure. */
import type { InvitePreview } from '../../shared/schema/classes';
import { whenText } from './due';

/** Why the invitation cannot be used, in words, or null while it is waiting to be accepted. */
export function inviteGoneText(p: Pick<InvitePreview, 'state' | 'instructorName' | 'expiresAt'>): string | null {
  switch (p.state) {
    case 'pending':
      return null;
    case 'accepted':
      return 'This invitation has been used already: each link joins one person once. If it was you, the class is on your Classes page.';
    case 'expired':
      return `This invitation expired on ${whenText(p.expiresAt)}. Ask ${p.instructorName} to send a new one.`;
    case 'withdrawn':
      return `${p.instructorName} withdrew this invitation. Ask them if you should still join.`;
  }
}
