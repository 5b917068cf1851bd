/** Password checks and hashing. */
import bcrypt from 'bcrypt';
import { User } from '../users/user.model';

let rounds = 12;
const dummyHashes = new Map<number, string>();

/** Sets the bcrypt cost of new hashes and of the comparison for unknown accounts (config BCRYPT_ROUNDS). */
export function usePasswordCost(cost: number): void {
  rounds = cost;
}

export function passwordCost(): number {
  return rounds;
}

// why: an unknown e-mail is compared against a hash of the same cost as a real one, so the answer takes as long
export function dummyHash(): string {
  let h = dummyHashes.get(rounds);
  if (!h) dummyHashes.set(rounds, (h = bcrypt.hashSync('brinkmark-no-such-user', rounds)));
  return h;
}

/** Hashes a password with bcrypt. */
export function hashPassword(password: string, cost = rounds): Promise<string> {
  return bcrypt.hash(password, cost);
}

/**
 * The active user with this e-mail and password, or null (never says which part was wrong). A hash
 * of another cost (older accounts) is replaced at a successful sign-in, so every stored hash, and the
 * dummy one, converge on one cost and one timing.
 */
export async function verifyCredentials(email: string, password: string): Promise<User | null> {
  const user = await User.findOne({ where: { email: email.toLowerCase() } });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? dummyHash());
  if (!user || !ok || !user.active) return null;
  if (bcrypt.getRounds(user.passwordHash) !== rounds) {
    await User.update({ passwordHash: await hashPassword(password) }, { where: { id: user.id } });
  }
  return user;
}
