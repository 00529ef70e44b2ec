import { csrfSync } from 'csrf-sync';

/**
 * Synchronizer-token CSRF protection tied to the session: every POST, PUT, PATCH and DELETE
 * (uploads included) must carry the session's token in the X-CSRF-Token header.
 */
export const csrf = csrfSync({
  getTokenFromRequest: (req) => {
    const header = req.headers['x-csrf-token'];
    return typeof header === 'string' ? header : undefined;
  },
  errorConfig: { statusCode: 403, message: 'missing or invalid CSRF token', code: 'EBADCSRFTOKEN' },
});
