/**
 * The file name of a download made from a sketch (its file, its CSV tables, its pictures): the
 * sketch's name with letters, digits, dots and dashes only, spaces as dashes, `sketch` when nothing is left.
 * One rule for the server's attachments and the board's own downloads.
 */
export function downloadBaseName(name: string): string {
  return (
    name
      .replace(/[^A-Za-z0-9 ._-]+/g, '')
      .trim()
      .replace(/\s+/g, '-')
      .slice(0, 80) || 'sketch'
  );
}
