/** An error meant for the caller: its status and message are sent as they are. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const badRequest = (message: string, details?: unknown) => new HttpError(400, message, details);
export const unauthorized = (message = 'sign in first') => new HttpError(401, message);
export const forbidden = (message = 'not allowed') => new HttpError(403, message);
export const notFound = (message = 'not found') => new HttpError(404, message);
export const conflict = (message: string, details?: unknown) => new HttpError(409, message, details);
/** The request is well formed but the record cannot give what it asks (a sketch that cannot be swept). */
export const unprocessable = (message: string, details?: unknown) => new HttpError(422, message, details);
