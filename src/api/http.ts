/**
 * The one place the client talks HTTP. Every state-changing call carries the
 * session's CSRF token, fetched once and fetched again when the session changes
 * (sign-in, sign-out) or when the server refuses it.
 */

/** A refusal from the API, carrying the server's message and its list of problems. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'ApiError';
  }

  /** The problems the server listed (for a 400), one line each. */
  get problems(): string[] {
    return Array.isArray(this.details) ? this.details.map(String) : [];
  }
}

let csrfToken: string | null = null;

async function fetchCsrfToken(): Promise<string> {
  const res = await fetch('/api/auth/csrf', { credentials: 'same-origin' });
  const body = (await res.json()) as { token: string };
  csrfToken = body.token;
  return csrfToken;
}

/** Forget the token: the session it belonged to has ended or been replaced. */
export function resetCsrfToken(): void {
  csrfToken = null;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

async function send(method: Method, url: string, body?: unknown, retried = false): Promise<Response> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  let payload: BodyInit | undefined;
  if (body instanceof FormData) payload = body;
  else if (body !== undefined) {
    headers['Content-Type'] = 'application/json';
    payload = JSON.stringify(body);
  }
  if (method !== 'GET') headers['X-CSRF-Token'] = csrfToken ?? (await fetchCsrfToken());

  let res: Response;
  try {
    res = await fetch(url, { method, headers, body: payload, credentials: 'same-origin' });
  } catch {
    throw new ApiError(0, 'The server could not be reached. Check the connection and try again.');
  }
  if (res.status === 403 && method !== 'GET' && !retried) {
    // The session may have been renewed since the token was fetched: try once more with a fresh one.
    const copy = res.clone();
    const text = await copy.text();
    if (/csrf/i.test(text)) {
      resetCsrfToken();
      return send(method, url, body, true);
    }
  }
  return res;
}

async function answer<T>(res: Response): Promise<T> {
  if (res.status === 204) return undefined as T;
  const type = res.headers.get('content-type') ?? '';
  const data: unknown = type.includes('json') ? await res.json() : await res.text();
  if (!res.ok) {
    const obj = (typeof data === 'object' && data !== null ? data : {}) as { error?: string; details?: unknown };
    throw new ApiError(res.status, obj.error ?? `The server answered ${res.status}.`, obj.details);
  }
  return data as T;
}

export const api = {
  get: async <T>(url: string) => answer<T>(await send('GET', url)),
  post: async <T>(url: string, body?: unknown) => answer<T>(await send('POST', url, body ?? {})),
  put: async <T>(url: string, body: unknown) => answer<T>(await send('PUT', url, body)),
  patch: async <T>(url: string, body: unknown) => answer<T>(await send('PATCH', url, body)),
  del: async <T = void>(url: string) => answer<T>(await send('DELETE', url)),
};

/** The message to show a user for any failure of an API call. */
export function errorMessage(err: unknown): string {
  if (err instanceof ApiError) {
    const problems = err.problems;
    return problems.length ? `${err.message}: ${problems.slice(0, 3).join('; ')}` : err.message;
  }
  return err instanceof Error ? err.message : String(err);
}
