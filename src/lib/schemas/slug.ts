// Slugs in addresses: lower-case words joined by dashes.
import { z } from 'zod';

export const slugSchema = z
  .string()
  .min(1)
  .max(120)
  .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'Use lower-case letters, digits and dashes.');

/** A fix named by its address in a form or request body. */
export const fixSlugSchema = z
  .string({ error: 'Name the fix by its address.' })
  .min(1, 'Name the fix by its address, e.g. tl2-tray-will-not-open-e21.')
  .max(120, 'A fix address has at most 120 characters.')
  .pipe(slugSchema);
