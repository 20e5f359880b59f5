import bcrypt from 'bcryptjs';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import type { SessionUser, SignUpInput } from '../../shared/api/auth';
import { AppError } from '../errors';
import { User } from '../models';

/** bcrypt cost: 2^12 rounds, about a quarter of a second here; the floor the foundation asks for is 10. */
export const BCRYPT_COST = 12;

const toSessionUser = (u: User): SessionUser => ({ id: u.id, email: u.email, displayName: u.displayName });

export const normaliseEmail = (email: string) => email.trim().toLowerCase();

/** Create an account; a second account on the same e-mail is a 409. */
export async function userCreate(input: SignUpInput, cost = BCRYPT_COST, transaction?: Transaction): Promise<SessionUser> {
  const passwordHash = await bcrypt.hash(input.password, cost);
  try {
    const user = await User.create({ email: normaliseEmail(input.email), displayName: input.displayName.trim(), passwordHash }, { transaction });
    return toSessionUser(user);
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw new AppError(409, 'email_taken', 'An account with this e-mail address exists already; sign in instead', 'email');
    throw err;
  }
}

// Compared against when the e-mail is unknown, so a wrong address takes as long as a wrong password.
const DUMMY_HASH = bcrypt.hashSync('loftbench-no-such-account', BCRYPT_COST);

/** The account for these credentials, or null. */
export async function userByCredentials(email: string, password: string): Promise<SessionUser | null> {
  const user = await User.findOne({ where: { email: normaliseEmail(email) } });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
  return user && ok ? toSessionUser(user) : null;
}

/** Whether `password` is this account's password (false for an unknown account). */
export async function userPasswordMatches(id: number, password: string): Promise<boolean> {
  const user = await User.findByPk(id, { attributes: ['passwordHash'] });
  return bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH).then((ok) => ok && user !== null);
}

/** Give an account a new password. Ending its sessions is the caller's choice (endSessionsOf). */
export async function userSetPassword(id: number, password: string, cost = BCRYPT_COST, transaction?: Transaction): Promise<void> {
  const passwordHash = await bcrypt.hash(password, cost);
  const [count] = await User.update({ passwordHash }, { where: { id }, transaction });
  if (count !== 1) throw new AppError(404, 'not_found', 'No such account');
  userCacheForget(id);
}

export async function userById(id: number): Promise<SessionUser | null> {
  const user = await User.findByPk(id);
  return user ? toSessionUser(user) : null;
}

export async function userByEmail(email: string): Promise<SessionUser | null> {
  const user = await User.findOne({ where: { email: normaliseEmail(email) } });
  return user ? toSessionUser(user) : null;
}

const USER_CACHE_MS = 30_000;
const userCache = new Map<number, { user: SessionUser | null; at: number }>();

/**
 * The account behind a session, remembered for 30 seconds: every request of a signed-in person needs it,
 * and it changes only when the person renames themselves (which calls userCacheForget). Ending sessions
 * does not rely on this cache: it deletes the session rows.
 */
export async function userByIdCached(id: number): Promise<SessionUser | null> {
  const hit = userCache.get(id);
  if (hit && Date.now() - hit.at < USER_CACHE_MS) return hit.user;
  const user = await userById(id);
  if (userCache.size > 10_000) userCache.clear();
  userCache.set(id, { user, at: Date.now() });
  return user;
}

export function userCacheForget(id: number) {
  userCache.delete(id);
}
