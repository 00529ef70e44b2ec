import { nextPath } from './next';

/**
 * Where a new account goes after its first sign-in. Sign-up finishes through a mailed link, which opens a new
 * page without the `next` query the visitor came with (an invitation's page, say), so it is kept in this
 * browser's storage between the two.
 */
const KEY = 'arcwright.afterSignup';

export function rememberAfterSignup(next: unknown): void {
  const path = nextPath(next, '');
  if (path) localStorage.setItem(KEY, path);
  else localStorage.removeItem(KEY);
}

/** The path remembered at sign-up (once: it is forgotten as it is read), or undefined. */
export function takeAfterSignup(): string | undefined {
  const path = localStorage.getItem(KEY) ?? '';
  localStorage.removeItem(KEY);
  return nextPath(path, '') || undefined;
}
