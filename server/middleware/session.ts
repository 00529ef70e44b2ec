import session from 'express-session';
import connectSessionSequelize from 'connect-session-sequelize';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Sequelize } from 'sequelize';
import type { Request, RequestHandler } from 'express';
import type { ServerConfig } from '../config';
import type { PublicUser } from '../models';
import { activeAccount, checkCredentials } from '../services/accounts';
import { sessionWithAccount, type SessionAccountRecord } from '../database';

declare module 'express-session' {
  interface SessionData {
    /** When the user signed in (ms since epoch), for the absolute timeout. */
    signedInAt?: number;
    passport?: { user?: number };
  }
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends PublicUser {}
  }
}

const SESSION_COOKIE = 'arcwright.sid';
/** How often expired session rows are deleted (ms). */
const SESSION_SWEEP_MS = 15 * 60_000;

/** A session's expiry is pushed forward in the database at most this often (ms)... */
const TOUCH_EVERY_MS = 60_000;
/**
 * ...and at most once per this fraction of the idle limit: a session touched T ms ago expires in idle − T ms,
 * so the pause between writes must stay well below the idle limit, or steady activity would still be
 * signed out when the idle limit is short.
 */
const TOUCHES_PER_IDLE_LIMIT = 4;
/** Sessions remembered for touch throttling before the memory is cleared. */
const TOUCH_MEMORY = 10_000;

const SequelizeStore = connectSessionSequelize(session.Store);

/** The account of a session row, as read with it (sessionWithAccount). */
type SessionAccount = SessionAccountRecord;

/** Where store.get leaves a session's account on the data it hands to express-session. */
const ACCOUNT = Symbol('account read with the session');
/** The account read with the request's session, for deserializeUser; gone with the request. */
const accountReadWithSession = new WeakMap<Request, SessionAccount | null>();

/** express-session stored in the `sessions` table, with the user id copied into its own column. */
export function sessionMiddleware(sequelize: Sequelize, config: ServerConfig): RequestHandler {
  const store = new SequelizeStore({
    db: sequelize,
    table: 'Session',
    expiration: config.sessionIdleMs,
    checkExpirationInterval: SESSION_SWEEP_MS,
    extendDefaultFields: (defaults: { data: string; expires: Date }, sess: session.SessionData) => ({
      data: defaults.data,
      expires: defaults.expires,
      userId: sess.passport?.user ?? null,
    }),
  });
  // The store's own timer would keep a finished test process alive; run our own, unref'd. Every instance runs it:
  // it deletes rows past their expiry, so runs at the same moment delete each row once and none fails.
  store.stopExpiringSessions();
  const sweepable = store as unknown as { clearExpiredSessions(): Promise<unknown> };
  setInterval(() => void sweepable.clearExpiredSessions(), SESSION_SWEEP_MS).unref();
  // The store reads a row without looking at its expiry; an idle session must not come back.
  // The row comes with its account, read in the same statement (sessionWithAccount): a signed-in request used to
  // read the session and then its account (deserializeUser) one after the other, and every signed-in request needs
  // the account anyway. Both are read afresh on every request, so a disabled account or a new role counts at once.
  store.get = (sid: string, cb: (err: unknown, s?: session.SessionData | null) => void) => {
    sessionWithAccount(sequelize, sid, new Date()).then((found) => {
      if (!found) return cb(null, null);
      const data = JSON.parse(found.data) as session.SessionData & { [ACCOUNT]?: SessionAccount | null };
      // A symbol key: express-session copies, hashes and saves only the string keys of the data.
      data[ACCOUNT] = found.account;
      cb(null, data);
    }, cb);
  };
  const createSession = store.createSession.bind(store);
  store.createSession = (req, data: session.SessionData & { [ACCOUNT]?: SessionAccount | null }) => {
    if (data[ACCOUNT] !== undefined) accountReadWithSession.set(req, data[ACCOUNT]);
    return createSession(req, data);
  };

  // express-session touches the row on every request (rolling expiry). Once a minute per session (less
  // with a short idle limit) keeps an active session alive and saves a write per call.
  const touchEveryMs = Math.min(TOUCH_EVERY_MS, config.sessionIdleMs / TOUCHES_PER_IDLE_LIMIT);
  const lastTouch = new Map<string, number>();
  const touch = store.touch.bind(store);
  store.touch = (sid: string, data: session.SessionData, cb?: (err?: unknown) => void) => {
    const now = Date.now();
    if (now - (lastTouch.get(sid) ?? 0) < touchEveryMs) return cb?.();
    if (lastTouch.size > TOUCH_MEMORY) lastTouch.clear();
    lastTouch.set(sid, now);
    return touch(sid, data, cb);
  };

  return session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      // 'auto': Secure whenever the request arrived over HTTPS (behind a trusted proxy too).
      secure: config.cookieSecure ? true : config.trustProxy ? 'auto' : false,
      maxAge: config.sessionIdleMs,
    },
  });
}

/** passport with the local (e-mail + password) strategy; the session holds only the user id. */
export function configurePassport(): void {
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      checkCredentials(email, password).then(
        (found) => ('user' in found ? done(null, found.user) : done(null, false, { message: found.refused })),
        done,
      );
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((req: Request, id: number, done: (err: unknown, user?: Express.User | false) => void) => {
    // false signs the request out: the account was removed or disabled since sign-in.
    const read = accountReadWithSession.get(req);
    if (read && read.id === id) {
      const { disabled, ...user } = read;
      return done(null, disabled ? false : user);
    }
    activeAccount(id).then((user) => done(null, user ?? false), done);
  });
}

/** Signs out a session that is older than the absolute limit, whatever its activity. */
export function absoluteTimeout(config: ServerConfig): RequestHandler {
  return (req, _res, next) => {
    const started = req.session?.signedInAt;
    if (req.user && started && Date.now() - started > config.sessionAbsoluteMs) {
      req.user = undefined;
      req.session.destroy((err) => next(err));
      return;
    }
    next();
  };
}

export { passport, SESSION_COOKIE };
