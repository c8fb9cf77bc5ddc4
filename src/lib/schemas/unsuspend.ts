// An admin lifting a member's suspension.
import { z } from 'zod';
import { userIdSchema } from './account-fields';

export const unsuspendSchema = z.object({ userId: userIdSchema });
export type UnsuspendInput = z.input<typeof unsuspendSchema>;
export type Unsuspend = z.output<typeof unsuspendSchema>;
