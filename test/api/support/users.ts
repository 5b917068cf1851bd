/** Extra people for specs that need several of one role (the demo agency has one of each). */
import bcrypt from 'bcrypt';
import { User } from '../../../api/users/user.model';
import type { Role } from '../../../api/users/user.schemas';

export const SPEC_PASSWORD = 'spec-password-2026';

/** Creates (or reuses) an active person of a role; returns the e-mail and password to sign in with. */
export async function specPerson(role: Role, tag: string): Promise<{ email: string; password: string }> {
  const email = `${tag}@spec.corran-firth.example`;
  if (!(await User.findOne({ where: { email } }))) {
    await User.create({ email, name: `Spec ${tag}`, role, passwordHash: await bcrypt.hash(SPEC_PASSWORD, 4), organisation: null, regionId: null });
  }
  return { email, password: SPEC_PASSWORD };
}
