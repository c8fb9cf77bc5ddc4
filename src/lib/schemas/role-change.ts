// An admin giving a member another role.
import { z } from 'zod';
import { roles } from '../permissions';
import { userIdSchema } from './account-fields';

export const roleChangeSchema = z.object({
  userId: userIdSchema,
  role: z.enum(roles, { error: 'Choose one of: member, editor, moderator, admin.' }),
});
export type RoleChangeInput = z.input<typeof roleChangeSchema>;
export type RoleChange = z.output<typeof roleChangeSchema>;
