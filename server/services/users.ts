import bcrypt from 'bcryptjs';
import { UniqueConstraintError } from 'sequelize';
import type { SessionUser, SignUpInput } from '../../shared/api/auth';
import { AppError } from '../errors';
import { User } from '../models';

/** bcrypt cost: 2^12 rounds, about a quarter of a second here; the floor the foundation asks for is 10. */
export const BCRYPT_COST = 12;

const toSessionUser = (u: User): SessionUser => ({ id: u.id, email: u.email, displayName: u.displayName });

export const normaliseEmail = (email: string) => email.trim().toLowerCase();

/** Create an account; a second account on the same e-mail is a 409. */
export async function userCreate(input: SignUpInput, cost = BCRYPT_COST): Promise<SessionUser> {
  const passwordHash = await bcrypt.hash(input.password, cost);
  try {
    const user = await User.create({ email: normaliseEmail(input.email), displayName: input.displayName.trim(), passwordHash });
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
