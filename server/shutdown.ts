import type { Server } from 'node:http';
import type { RequestHandler, Response } from 'express';

/** How long a shutdown waits for the requests in flight to be answered before it closes anyway (ms). */
export const SHUTDOWN_GRACE_MS = 10_000;

/** What a request that arrives while the server shuts down is told. */
export const SHUTTING_DOWN_ERROR = 'the server is shutting down; try again in a moment';

/** Where `admit` leaves the gate on an admitted request's response, for `shuttingDown`. */
const GATE = Symbol('request gate');

/**
 * Counts the requests being answered, and once `stopAdmitting` ran, answers every new request with a JSON 503 before
 * any of it reaches the session, the database or a route.
 *
 * A request counts from its arrival until its handler ends the answer (res.end), not until its connection closes: a
 * client that gives up (a benchmark stopping, a closed tab) closes the connection while the handler still works on
 * the database, and the database must stay open until that work is over. An answer whose headers went out and whose
 * connection then closed (a stream cut short) counts as over too, as no handler is left to end it.
 */
export class RequestGate {
  private admitting = true;
  private active = 0;
  private idleWaiters: (() => void)[] = [];

  /** Whether new requests are refused (a shutdown has begun). */
  get closing(): boolean {
    return !this.admitting;
  }

  /** Requests admitted and not yet answered. */
  get inFlight(): number {
    return this.active;
  }

  readonly admit: RequestHandler = (_req, res, next) => {
    if (!this.admitting) {
      res.set('Connection', 'close');
      res.status(503).json({ error: SHUTTING_DOWN_ERROR });
      return;
    }
    (res.locals as Record<symbol, unknown>)[GATE] = this;
    this.active += 1;
    let counted = true;
    const done = () => {
      if (!counted) return;
      counted = false;
      this.active -= 1;
      if (this.active === 0) for (const wake of this.idleWaiters.splice(0)) wake();
    };
    const end = res.end.bind(res) as (...args: unknown[]) => Response;
    res.end = ((...args: unknown[]) => {
      done();
      return end(...args);
    }) as Response['end'];
    res.once('close', () => {
      if (res.headersSent) done();
    });
    next();
  };

  /** From now on every new request gets the 503. */
  stopAdmitting(): void {
    this.admitting = false;
  }

  /** Resolves true once no admitted request is left, or false after `timeoutMs` with some still in flight. */
  whenIdle(timeoutMs: number): Promise<boolean> {
    if (this.active === 0) return Promise.resolve(true);
    return new Promise((resolve) => {
      const timer = setTimeout(() => {
        this.idleWaiters = this.idleWaiters.filter((w) => w !== wake);
        resolve(false);
      }, timeoutMs);
      const wake = () => {
        clearTimeout(timer);
        resolve(true);
      };
      this.idleWaiters.push(wake);
    });
  }
}

/** Whether the request this answer belongs to was admitted by a gate that is now closing. */
export function shuttingDown(res: Response): boolean {
  const gate = (res.locals as Record<symbol, unknown> | undefined)?.[GATE];
  return gate instanceof RequestGate && gate.closing;
}

/** What a shutdown closes, in the order it closes them. */
export interface ShutdownSteps {
  server: Server;
  gate: RequestGate;
  /** The bounded wait for requests in flight (ms); SHUTDOWN_GRACE_MS unless given. */
  graceMs?: number;
  /** Stops the periodic work (housekeeping). */
  stopTimers(): void;
  /** Stops the mailer (mail still queued stays in the database for the next start). */
  closeMail(): Promise<void>;
  closeDatabase(): Promise<void>;
}

/**
 * Shuts the server down in an order that leaves no request without the database: no new connections and a 503 for
 * new requests at once; then a bounded wait for the requests in flight; then every connection still open is
 * closed; and only then the timers, the mail and the database. Answers whether every request in flight was answered
 * within the grace period.
 */
export async function shutDown(steps: ShutdownSteps): Promise<boolean> {
  const { server, gate } = steps;
  gate.stopAdmitting();
  const closed = new Promise<void>((resolve) => server.close(() => resolve()));
  server.closeIdleConnections();
  const drained = await gate.whenIdle(steps.graceMs ?? SHUTDOWN_GRACE_MS);
  // Kept-alive connections and, after the grace period, connections of requests still running.
  server.closeAllConnections();
  await closed;
  steps.stopTimers();
  await steps.closeMail();
  await steps.closeDatabase();
  return drained;
}
