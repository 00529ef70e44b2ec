/**
 * The size limits of the HTTP API, one definition for the server that applies them and the client that
 * checks a file before sending it, and the one way their sizes are written in messages.
 * Sizes are in bytes; a KB is 1024 bytes and an MB 1024 KB, as the server's body parsers count them.
 */

/** Largest JSON request body (bytes); a sketch file is a few tens of KB. */
export const JSON_BODY_MAX_BYTES = 256 * 1024;

/**
 * Deepest nesting of arrays and objects a JSON request body may have. A sketch file inside a request is
 * under ten levels deep; the margin leaves room for the format to grow, and anything deeper is refused
 * before any code walks it recursively.
 */
export const JSON_MAX_DEPTH = 32;

/** Largest uploaded file (bytes): a tracing photo. */
export const UPLOAD_MAX_BYTES = 10 * 1024 * 1024;

/**
 * The image types an upload may be (decided by the server from the file's first bytes) and the file
 * extension each is stored under. The board's file picker offers the same list.
 */
export const UPLOAD_IMAGE_TYPES = { 'image/png': 'png', 'image/jpeg': 'jpg' } as const;

/** The accepted media types, as a file input's `accept` list. */
export const UPLOAD_ACCEPT = Object.keys(UPLOAD_IMAGE_TYPES).join(',');

const KB = 1024;
const MB = 1024 * KB;

/** A size for people: "256 KB", "10 MB", "1.5 MB" (at most one decimal, none when whole), "512 bytes". */
export function byteSizeText(bytes: number): string {
  if (!Number.isFinite(bytes) || bytes < 0) throw new RangeError(`not a size in bytes: ${bytes}`);
  if (bytes >= MB) return `${oneDecimal(bytes / MB)} MB`;
  if (bytes >= KB) return `${oneDecimal(bytes / KB)} KB`;
  return `${bytes} byte${bytes === 1 ? '' : 's'}`;
}

/** 10 → "10", 1.25 → "1.3": one decimal at most, no trailing ".0". */
function oneDecimal(n: number): string {
  return String(Math.round(n * 10) / 10);
}
