import { afterAll, beforeAll } from 'vitest';
import { startTestServer, type TestServer } from './helpers';

/** A test server whose mail cannot go, and what it logged about mail that failed. */
export interface MailDown {
  /** The server; set once the file's beforeAll has run. */
  server: TestServer;
  /** What the server logged about mail to `to` (one line per failed attempt), oldest first. */
  failuresTo(to: string): string[];
}

/**
 * Starts, for the test file that calls it, a server whose SMTP server refuses connections (nothing listens on
 * the discard port), and keeps what it writes to console.error (each failed mail attempt) out of the test
 * output, for the tests to read instead.
 */
export function withMailDown(): MailDown {
  const logged: unknown[][] = [];
  const originalError = console.error;
  const down: MailDown = {
    server: undefined as unknown as TestServer,
    failuresTo: (to) => logged.map((args) => String(args[0])).filter((line) => line.includes(`mail to ${to}`)),
  };
  beforeAll(async () => {
    console.error = (...args: unknown[]) => {
      logged.push(args);
    };
    down.server = await startTestServer({ SMTP_URL: 'smtp://127.0.0.1:9' });
  });
  afterAll(async () => {
    await down.server.close();
    console.error = originalError;
  });
  return down;
}
