import { emailField } from '../../../shared/schema/accounts';
import { INVITES_PER_REQUEST_MAX, type InviteBody, type InviteResult } from '../../../shared/schema/classes';
import { badRequest } from '../../middleware/http-error';

/** Longest address accepted (RFC 5321 §4.5.3.1.3 path limit less the angle brackets). */
const EMAIL_MAX = 254;

export interface ReadList {
  /** well-formed addresses, lower-cased, each once, in the order given */
  good: string[];
  refused: InviteResult['refused'];
  skipped: InviteResult['skipped'];
}

/** The entries of a pasted list: a string is split on commas, semicolons, spaces and new lines. */
function entriesOf(emails: InviteBody['emails']): string[] {
  const raw = typeof emails === 'string' ? emails.split(/[\s,;]+/) : emails;
  // "<someone@example.test>" as mail programs copy it; blank entries (", ,") are nothing.
  return raw.map((e) => e.trim().replace(/^<(.*)>$/, '$1')).filter((e) => e !== '');
}

/**
 * Checks each entry of the list on its own: a malformed one is refused by name with its problem, a repeat
 * is skipped, and the rest go on. 400 for an empty list or one longer than INVITES_PER_REQUEST_MAX.
 */
export function readInviteList(emails: InviteBody['emails']): ReadList {
  const entries = entriesOf(emails);
  if (!entries.length) throw badRequest('emails: the list holds no address');
  if (entries.length > INVITES_PER_REQUEST_MAX) {
    throw badRequest(
      `emails: the list holds ${entries.length} addresses; at most ${INVITES_PER_REQUEST_MAX} can be invited at once`,
    );
  }
  const out: ReadList = { good: [], refused: [], skipped: [] };
  const seen = new Set<string>();
  for (const entry of entries) {
    if (entry.length > EMAIL_MAX) {
      out.refused.push({ email: entry, problem: `longer than ${EMAIL_MAX} characters` });
      continue;
    }
    const parsed = emailField.safeParse(entry);
    if (!parsed.success) {
      out.refused.push({ email: entry, problem: 'not an e-mail address' });
      continue;
    }
    if (seen.has(parsed.data)) {
      out.skipped.push({ email: parsed.data, reason: 'named more than once in the list; invited once' });
      continue;
    }
    seen.add(parsed.data);
    out.good.push(parsed.data);
  }
  return out;
}
