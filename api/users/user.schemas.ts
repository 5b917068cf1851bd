/** Contract of the users API: shared with the client through `import type`. */
import { z } from 'zod';

export const ROLES = ['admin', 'assessor', 'board', 'licensee'] as const;
export type Role = (typeof ROLES)[number];

/** What mail a licensee receives: every advisory, corrections only, or a weekly digest. */
export const MAIL_PREFERENCES = ['every', 'corrections', 'digest'] as const;
export type MailPreference = (typeof MAIL_PREFERENCES)[number];

export const mailPreferenceSchema = z.object({ mailPreference: z.enum(MAIL_PREFERENCES) }).strict();

export const createUserSchema = z.object({
  email: z.email().max(190),
  name: z.string().trim().min(2).max(120),
  role: z.enum(ROLES),
  password: z.string().min(10, 'at least 10 characters').max(128),
  organisation: z.string().trim().max(160).nullish(),
  regionId: z.number().int().positive().nullish(),
}).strict();

export const updateUserSchema = z.object({
  role: z.enum(ROLES).optional(),
  active: z.boolean().optional(),
  regionId: z.number().int().positive().nullable().optional(),
  /** Makes this board member the chair (the previous chair steps down in the same change). */
  boardChair: z.boolean().optional(),
}).strict().refine((v) => Object.keys(v).length > 0, { message: 'nothing to change' });

export const resetPasswordSchema = z.object({
  password: z.string().min(10, 'at least 10 characters').max(128),
}).strict();

export type CreateUserBody = z.infer<typeof createUserSchema>;
export type UpdateUserBody = z.infer<typeof updateUserSchema>;
export type ResetPasswordBody = z.infer<typeof resetPasswordSchema>;

/** A user as the API returns it (never the password hash). */
export interface UserView {
  id: number;
  email: string;
  name: string;
  role: Role;
  organisation: string | null;
  regionId: number | null;
  active: boolean;
  /** Chairs the quota board: records its decisions. */
  boardChair: boolean;
  /** A licensee's choice of advisory mail. */
  mailPreference: MailPreference;
  createdAt: string;
}
