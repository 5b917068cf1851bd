/** Contract of the sign-in API: shared with the client through `import type`. */
import { z } from 'zod';
import type { UserView } from '../users/user.schemas';

export const signInSchema = z.object({
  email: z.email('enter an e-mail address').max(190),
  password: z.string().min(1, 'enter your password').max(128),
}).strict();

export type SignInBody = z.infer<typeof signInSchema>;

export interface SessionView {
  user: UserView;
  csrfToken: string;
}

/** The answer to "is anyone signed in?", which a visitor gets without an error. */
export interface OpenSessionView {
  user: UserView | null;
  csrfToken: string;
}
