// A follow or unfollow request from a page's form (or an island): what to follow, named by its address slug.
import { z } from 'zod';
import { followTargetKinds } from '@/lib/notifications/kinds';

export const followSchema = z.object(
  {
    kind: z.enum(followTargetKinds, {
      error: 'Say what to follow: a machine, chassis, maker or fix, for example kind=machine.',
    }),
    slug: z
      .string({ error: 'Name what to follow by its address, for example slug=tamberlyn-tv-820.' })
      .trim()
      .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'Name what to follow by its address, for example slug=tamberlyn-tv-820.'),
    follow: z.enum(['yes', 'no'], { error: 'Say whether to follow or stop, for example follow=yes.' }).default('yes'),
    /** Where the form came from, so the reader lands back on the same page. */
    back: z
      .string({ error: 'The page to come back to is an address on this site, for example /machines.' })
      .max(500, 'The page to come back to is at most 500 characters, for example /machines.')
      .optional(),
  },
  { error: 'Send the follow form as fields, for example kind=machine and slug=tamberlyn-tv-820.' },
);
export type FollowInput = z.input<typeof followSchema>;
export type FollowRequest = z.output<typeof followSchema>;
