/** Password checks and hashing. */
import bcrypt from 'bcrypt';
import { User } from '../users/user.model';

const BCRYPT_ROUNDS = 12;
// why: compare against a real hash even for unknown e-mails, so timing does not reveal accounts
const DUMMY_HASH = bcrypt.hashSync('brinkmark-no-such-user', 4);

/** Hashes a password with bcrypt. */
export function hashPassword(password: string, rounds = BCRYPT_ROUNDS): Promise<string> {
  return bcrypt.hash(password, rounds);
}

/** The active user with this e-mail and password, or null (never says which part was wrong). */
export async function verifyCredentials(email: string, password: string): Promise<User | null> {
  const user = await User.findOne({ where: { email: email.toLowerCase() } });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
  return user && ok && user.active ? user : null;
}
