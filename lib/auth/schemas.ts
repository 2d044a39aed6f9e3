import { z } from 'zod';
import { roleSchema } from './roles';

export const passwordSignInSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter an e-mail address'),
  password: z.string().min(1, 'Enter your password').max(200),
});

/** Shared by the invite form (react-hook-form) and the server action. */
export const inviteSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter an e-mail address').max(254),
  roles: z.array(roleSchema).min(1, 'Pick at least one role'),
});
export type InviteInput = z.infer<typeof inviteSchema>;

export const memberRolesSchema = z.object({
  userId: z.string().uuid(),
  roles: z.array(roleSchema).min(1, 'A member keeps at least one role; remove them instead'),
});
