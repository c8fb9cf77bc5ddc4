// The name other members see and the optional shop name.
import { z } from 'zod';
import { displayNameSchema, shopNameSchema } from './account-fields';

export const profileSchema = z.object({ name: displayNameSchema, shopName: shopNameSchema });
export type ProfileInput = z.infer<typeof profileSchema>;
export type ProfileFields = z.input<typeof profileSchema>;
