import { Router, type Request, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import { AppError } from '../lib/app-error';
import { requireUser } from '../middleware/require-role';
import { dropCsrfToken, requireCsrfToken } from '../middleware/csrf';
import type { AppPassport, SignInInfo } from './passport';
import { sessionCookie } from './session-store';
import { validated } from '../middleware/validate';
import { emailSignInSchema, type EmailSignInResponse } from '../../shared/schemas/me';
import { EMAIL_LINK_MINUTES, redeemEmailLink, requestEmailLink } from './email-sign-in.service';
import type { Db } from '../db/client';
import type { Mailer } from '../mail/mailer';
import type { Clock } from '../lib/clock';

declare module 'express-session' {
  interface SessionData {
    returnTo?: string;
  }
}

export const signInFailedPath = '/signin-failed';

/** Only a path on this site, never `//host` or `/\host` (which browsers treat as another site), and never back into /auth. */
export function safeReturnTo(value: unknown): string | null {
  if (typeof value !== 'string' || value.length > 512) return null;
  if (!value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return null;
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f\\]/.test(value)) return null;
  const url = new URL(value, 'http://swapyard.local');
  if (url.host !== 'swapyard.local' || url.pathname.startsWith('/auth/')) return null;
  return url.pathname + url.search + url.hash;
}

type FailReason = 'state' | 'provider' | 'suspended' | 'denied' | 'link';

function failed(req: Request, res: Response, reason: FailReason, detail?: string) {
  req.log?.warn({ event: 'sign_in_failed', reason, detail }, 'sign-in failed');
  res.redirect(302, `${signInFailedPath}?reason=${reason}`);
}

/** Mounted on all of /auth (the fake authorize page included). */
export function authRateLimit(limit: number) {
  return rateLimit({
    windowMs: 15 * 60 * 1000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (req, _res, next, options) => {
      req.log?.warn({ event: 'rate_limited', path: req.originalUrl }, 'sign-in rate limit reached');
      const minutes = Math.ceil(options.windowMs / 60000);
      next(
        new AppError('rate_limited', `Too many sign-in attempts from your address. Wait ${minutes} minutes and try again.`, 429),
      );
    },
  });
}

/** Asking for sign-in links is tighter than the rest of /auth: each one sends an e-mail. */
function emailLinkRateLimit() {
  return rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: EMAIL_LINK_REQUESTS_PER_15_MIN,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (req, _res, next) => {
      req.log?.warn({ event: 'rate_limited', path: req.originalUrl }, 'sign-in link rate limit reached');
      next(new AppError('rate_limited', 'Too many sign-in links asked for from your address. Wait 15 minutes and try again.', 429));
    },
  });
}
export const EMAIL_LINK_REQUESTS_PER_15_MIN = 10;

export function authRouter({
  passport,
  appUrl,
  endSessions,
  db,
  mailer,
  clock,
}: {
  passport: AppPassport;
  appUrl: string;
  /** ends every session of a user, this one included; returns how many */
  endSessions: (userId: number) => number;
  db: Db;
  mailer: Mailer;
  clock: Clock;
}) {
  const router = Router();
  const cookie = sessionCookie(appUrl);

  router.post(
    '/email',
    emailLinkRateLimit(),
    validated({ body: emailSignInSchema }, ({ body }, req, res) => {
      const sent = requestEmailLink({ db, mailer, clock, appUrl }, { email: body.email, returnTo: safeReturnTo(body.returnTo) });
      // the same answer either way: whether an address is known, or over its allowance, is nobody's business
      if (!sent) req.log?.warn({ event: 'sign_in_link_dropped', reason: 'address_allowance' }, 'sign-in link not sent');
      const answer: EmailSignInResponse = { sent: true, minutes: EMAIL_LINK_MINUTES };
      res.status(202).json(answer);
    }),
  );

  router.get('/email/callback', (req, res, next) => {
    const token = typeof req.query.token === 'string' && req.query.token.length <= 100 ? req.query.token : '';
    const result = token ? redeemEmailLink(db, clock, token) : ({ ok: false, reason: 'link' } as const);
    if (!result.ok) {
      if (result.reason === 'suspended') {
        req.log?.warn({ event: 'sign_in_refused', userId: result.userId, reason: 'suspended' }, 'suspended account refused');
        return res.redirect(302, `${signInFailedPath}?reason=suspended`);
      }
      return failed(req, res, 'link', 'unknown, used or expired sign-in link');
    }
    const user = result.user as Express.User;
    // a fresh session id, as with the provider: passport regenerates it here
    req.logIn(user, { session: true }, (loginErr) => {
      if (loginErr) return next(loginErr);
      dropCsrfToken(req);
      req.log?.info({ event: 'sign_in', userId: user.id, login: user.login, created: result.created, via: 'email' }, 'signed in');
      res.redirect(302, safeReturnTo(result.returnTo) ?? '/');
    });
  });

  router.get('/github', (req, res, next) => {
    const returnTo = safeReturnTo(req.query.returnTo);
    if (returnTo) req.session.returnTo = returnTo;
    else delete req.session.returnTo;
    passport.authenticate('github')(req, res, next);
  });

  router.get('/github/callback', (req, res, next) => {
    passport.authenticate('github', (err: unknown, user: Express.User | false, info?: SignInInfo) => {
      if (err) return failed(req, res, 'provider', err instanceof Error ? err.message : 'unknown error');
      if (!user) {
        if (info?.reason === 'suspended') {
          req.log?.warn({ event: 'sign_in_refused', userId: info.userId, reason: 'suspended' }, 'suspended account refused');
          return res.redirect(302, `${signInFailedPath}?reason=suspended`);
        }
        if (typeof req.query.error === 'string') return failed(req, res, 'denied', req.query.error);
        return failed(req, res, 'state', info?.message);
      }
      // passport regenerates the session id here; keepSessionInfo carries returnTo across
      req.logIn(user, { session: true, keepSessionInfo: true }, (loginErr) => {
        if (loginErr) return next(loginErr);
        const target = safeReturnTo(req.session.returnTo) ?? '/';
        delete req.session.returnTo;
        dropCsrfToken(req);
        req.log?.info({ event: 'sign_in', userId: user.id, login: user.login, created: info?.created ?? false }, 'signed in');
        res.redirect(302, target);
      });
    })(req, res, next);
  });

  router.post('/logout', requireCsrfToken, (req, res, next) => {
    const userId = req.user?.id ?? null;
    req.session.destroy((err) => {
      if (err) return next(err);
      req.log?.info({ event: 'sign_out', userId }, 'signed out');
      res.clearCookie(cookie.name, cookie.options);
      res.status(204).end();
    });
  });

  // a lost phone, a shared computer: every session of this member ends, this one too
  router.post('/logout/everywhere', requireCsrfToken, requireUser, (req, res, next) => {
    const userId = req.user!.id;
    const ended = endSessions(userId);
    req.session.destroy((err) => {
      if (err) return next(err);
      req.log?.info({ event: 'sign_out_everywhere', userId, sessionsEnded: ended }, 'signed out everywhere');
      res.clearCookie(cookie.name, cookie.options);
      res.status(204).end();
    });
  });

  return router;
}
