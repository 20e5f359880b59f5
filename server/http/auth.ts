import type { Application, Express, RequestHandler } from 'express';
import session from 'express-session';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import connectSessionSequelize from 'connect-session-sequelize';
import { Op, type Sequelize } from 'sequelize';
import type { Config } from '../config';
import { AppError } from '../errors';
import { Session } from '../models';
import { userByCredentials, userByIdCached, userCacheForget } from '../services/users';
import type { SessionUser } from '../../shared/api/auth';
import { cachedSessionStore } from './session-store';

const SequelizeStore = cachedSessionStore(connectSessionSequelize(session.Store));

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}
declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
    /** The day (UTC, yyyy-mm-dd) the session was last extended. */
    extendedOn?: string;
  }
}

const TWO_WEEKS_MS = 14 * 24 * 3600 * 1000;

/**
 * Sessions in MariaDB (the `sessions` table made by a migration), passport-local with bcrypt-hashed
 * passwords. The cookie is httpOnly and SameSite=Lax, and Secure when the server sits behind HTTPS.
 */
export function installAuth(app: Express, config: Config, sequelize: Sequelize) {
  // disableTouch is read by the store (lib/connect-session-sequelize.js) but missing from its types.
  const storeOptions: ConstructorParameters<typeof SequelizeStore>[0] & { disableTouch: boolean } = {
    db: sequelize,
    table: 'Session',
    checkExpirationInterval: config.mode === 'test' ? 0 : 15 * 60 * 1000,
    expiration: TWO_WEEKS_MS,
    // No write on every request: sessions are extended once a day instead (see extendDaily below).
    disableTouch: true,
    // Kept on the row so that every session of one account can be ended at once.
    extendDefaultFields: (defaults: { data: string; expires: Date }, data: { passport?: { user?: number } }) => ({
      ...defaults,
      userId: data?.passport?.user ?? null,
    }),
  };
  const store = new SequelizeStore(storeOptions);
  // For endSessionsOf(): the cache in front of the rows lives in this store.
  app.locals.sessionStore = store;

  app.use(
    session({
      name: 'loftbench.sid',
      secret: config.sessionSecret,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: false,
      proxy: config.trustProxy,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.trustProxy ? 'auto' : false, maxAge: TWO_WEEKS_MS },
    }),
  );

  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      userByCredentials(email, password).then((user) => done(null, user ?? false), done);
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((id: number, done) => {
    userByIdCached(id).then((user) => done(null, user ?? false), done);
  });
  app.use(passport.session());
  app.use(extendDaily);
  return { store };
}

/**
 * A signed-in session lasts two weeks from the last day it was used. Marking the day in the session
 * makes express-session save the row and resend the cookie once a day rather than on every request.
 */
const extendDaily: RequestHandler = (req, _res, next) => {
  if (req.user) {
    const today = new Date().toISOString().slice(0, 10);
    if (req.session.extendedOn !== today) {
      req.session.extendedOn = today;
      req.session.cookie.maxAge = TWO_WEEKS_MS;
    }
  }
  next();
};

/** Routes behind this need a signed-in person; anyone else gets 401. */
export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new AppError(401, 'not_signed_in', 'Sign in to continue'));
  next();
};

/** Sign a person in on this request: a new session id (no fixation), then the login. */
export function signIn(req: Parameters<RequestHandler>[0], user: SessionUser): Promise<void> {
  return new Promise((resolve, reject) => {
    req.session.regenerate((err) => {
      if (err) return reject(err);
      req.login(user, (loginErr) => (loginErr ? reject(loginErr) : resolve()));
    });
  });
}

/**
 * End every session of one account (after a password reset, or a change with "sign out everywhere"):
 * delete the rows, then forget them in the store's read cache and the account cache, so the next
 * request of any of them is anonymous. `exceptSid` keeps the session making the change.
 */
export async function endSessionsOf(app: Application, userId: number, exceptSid?: string): Promise<void> {
  await Session.destroy({ where: exceptSid ? { userId, sid: { [Op.ne]: exceptSid } } : { userId } });
  (app.locals.sessionStore as InstanceType<typeof SequelizeStore>).forgetUser(userId);
  userCacheForget(userId);
}

/** Sign out and destroy the session row. */
export function signOut(req: Parameters<RequestHandler>[0]): Promise<void> {
  return new Promise((resolve, reject) => {
    req.logout((err) => {
      if (err) return reject(err);
      req.session.destroy((destroyErr) => (destroyErr ? reject(destroyErr) : resolve()));
    });
  });
}
