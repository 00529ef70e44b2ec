/**
 * Where to go after signing in or up: the page that sent the visitor (the `next` query), when it is a
 * path of this app. Anything else (another site, "//host", a list) goes to the fallback.
 */
export function nextPath(raw: unknown, fallback = '/library'): string {
  if (typeof raw !== 'string') return fallback;
  return raw.startsWith('/') && !raw.startsWith('//') && !raw.startsWith('/\\') ? raw : fallback;
}
