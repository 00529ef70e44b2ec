import { Router, type NextFunction, type Request, type Response } from 'express';
import type { ServerConfig } from '../config';
import type { PublicUser } from '../models';
import type { Csrf } from '../middleware/csrf';
import { forbidden, unauthorized } from '../middleware/http-error';
import { parseOr400, validBody } from '../middleware/validate';
import { loginLimiters, resetRequestLimiters, signupLimiters } from '../middleware/rate-limit';
import { passport, SESSION_COOKIE } from '../middleware/session';
import { loginBody, resetBody, resetRequestBody, signupBody, signupConfirmBody } from '../../shared/schema/accounts';
import type { z } from 'zod';
import { confirmSignup, requestSignup } from '../services/signup';
import type { Mailer } from '../services/mail/mailer';
import { requestPasswordReset, resetPassword } from '../services/password-reset';

/** Signs `user` in on a fresh session id (passport regenerates the session), starting the absolute clock. */
function signIn(req: Request, user: PublicUser): Promise<void> {
  return new Promise((resolve, reject) =>
    req.login(user, (err) => {
      if (err) return reject(err);
      req.session.signedInAt = Date.now();
      resolve();
    }),
  );
}

/** The account for the posted credentials, or the reason there is none (see `checkCredentials`). */
function authenticateLocal(
  req: Request,
  res: Response,
  next: NextFunction,
): Promise<PublicUser | 'wrong' | 'disabled'> {
  return new Promise((resolve, reject) =>
    passport.authenticate(
      'local',
      { session: false },
      (err: unknown, user: PublicUser | false, info?: { message?: string }) => {
        if (err) return reject(err);
        resolve(user || (info?.message === 'disabled' ? 'disabled' : 'wrong'));
      },
    )(req, res, next),
  );
}

type SignupBody = z.infer<typeof signupBody>;

/** /api/auth: sign-up, sign-in, sign-out, who am I, and the CSRF token. */
export function authRoutes(config: ServerConfig, mailer: Mailer, csrf: Csrf): Router {
  const router = Router();

  router.get('/csrf', (req, res) => {
    res.json({ token: csrf.token(req, res) });
  });

  router.get('/me', (req, res) => {
    if (!req.user) throw unauthorized('not signed in');
    res.json({ user: req.user });
  });

  // The same answer whether or not the address has an account; see services/signup.ts.
  const signups = signupLimiters(config);
  router.post('/signup', signups.perAddress, validBody(signupBody), signups.perAccount, async (req, res) => {
    await requestSignup(req.body as SignupBody, config, mailer);
    res.status(202).json({ status: 'check your e-mail: the link in it finishes signing up' });
  });

  router.post('/signup/confirm', async (req, res) => {
    const { token } = parseOr400(signupConfirmBody, req.body);
    res.status(201).json({ user: await confirmSignup(token, config) });
  });

  const login = loginLimiters(config);
  router.post('/login', login.perAddress, validBody(loginBody), login.perAccount, async (req, res, next) => {
    const user = await authenticateLocal(req, res, next);
    if (user === 'wrong') throw unauthorized('wrong e-mail or password');
    if (user === 'disabled')
      throw forbidden('this account is disabled; ask an administrator of this site to enable it');
    await signIn(req, user);
    res.json({ user });
  });

  router.post('/logout', (req, res, next) => {
    req.session.destroy((err) => {
      if (err) return next(err);
      res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'lax', path: '/' });
      res.status(204).end();
    });
  });

  const resets = resetRequestLimiters(config);
  router.post('/reset-request', resets.perAddress, validBody(resetRequestBody), resets.perAccount, async (req, res) => {
    const { email } = req.body as { email: string };
    await requestPasswordReset(email, config, mailer);
    res.status(202).json({ status: 'if an account has this e-mail, a reset link is on its way' });
  });

  router.post('/reset', async (req, res) => {
    const { token, password } = parseOr400(resetBody, req.body);
    await resetPassword(token, password);
    res.status(204).end();
  });

  return router;
}
