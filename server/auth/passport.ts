import passport from 'passport';
import { Strategy as GitHubStrategy, type StrategyOptions, type Profile } from 'passport-github2';
import type { Db } from '../db/client';
import type { Clock } from '../lib/clock';
import type { Config } from '../config';
import { loadSessionUser, signInFromProfile, type ProviderProfile } from './sign-in.service';

/** What the strategy hands the callback route besides the user. */
export type SignInInfo = { created?: boolean; reason?: 'suspended'; userId?: number; message?: string };

export const callbackPath = '/auth/github/callback';
export const fakeAuthorizePath = '/auth/fake/authorize';

function toProviderProfile(p: Profile): ProviderProfile {
  return {
    provider: 'github',
    providerId: p.id,
    login: p.username ?? p.id,
    name: p.displayName || null,
    email: p.emails?.[0]?.value ?? null,
    avatarUrl: p.photos?.[0]?.value ?? null,
  };
}

/**
 * One passport instance per app (tests build several apps over different databases).
 * The strategy is the real one in both modes; the fake mode only moves the browser's
 * authorize step to our own page, and msw answers the token and profile requests.
 */
export function createPassport({ db, clock, config }: { db: Db; clock: Clock; config: Config }) {
  const pp = new passport.Passport();
  const fake = config.auth.mode === 'fake';
  const options = {
    clientID: config.auth.clientId,
    clientSecret: config.auth.clientSecret,
    // the fake resolves against the request's own host, so tests on a random port work
    callbackURL: fake ? callbackPath : `${config.appUrl}${callbackPath}`,
    ...(fake ? { authorizationURL: fakeAuthorizePath } : {}),
    scope: ['user:email'],
    userAgent: 'swapyard',
    state: true,
    sessionKey: 'oauth2:github',
  };
  pp.use(
    new GitHubStrategy(
      options as unknown as StrategyOptions, // `state: true` is the oauth2 base's option, missing from these types
      (
        _accessToken: string,
        _refreshToken: string,
        profile: Profile,
        done: (err: unknown, user?: Express.User | false, info?: SignInInfo) => void,
      ) => {
        try {
          const result = signInFromProfile(db, clock, toProviderProfile(profile));
          if (!result.ok) {
            return done(null, false, { reason: 'suspended', userId: result.userId, message: 'This account is suspended.' });
          }
          done(null, result.user, { created: result.created });
        } catch (err) {
          done(err);
        }
      },
    ),
  );
  pp.serializeUser((user, done) => done(null, user.id));
  // read fresh on every request: a role change applies at once, a suspended user is signed out
  pp.deserializeUser((id: unknown, done) => {
    try {
      done(null, typeof id === 'number' ? (loadSessionUser(db, id) ?? false) : false);
    } catch (err) {
      done(err);
    }
  });
  return pp;
}

export type AppPassport = ReturnType<typeof createPassport>;
