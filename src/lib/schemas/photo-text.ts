// A photo's alt text and caption, as the upload form, the photo endpoint and the editor's island send them.
import { z } from 'zod';

export const MAX_ALT_LENGTH = 300;
export const MAX_CAPTION_LENGTH = 500;

export const photoTextSchema = z.object(
  {
    alt: z
      .string({ error: 'Describe what the photo shows (alt text), for readers who cannot see it.' })
      .trim()
      .min(1, 'Describe what the photo shows (alt text), for readers who cannot see it.')
      .max(MAX_ALT_LENGTH, `Alt text is at most ${MAX_ALT_LENGTH} characters.`),
    caption: z
      .string({ error: 'Write the caption as text.' })
      .trim()
      .max(MAX_CAPTION_LENGTH, `The caption is at most ${MAX_CAPTION_LENGTH} characters.`)
      .default(''),
  },
  { error: 'Send the photo’s alt text and an optional caption.' },
);
export type PhotoTextInput = z.input<typeof photoTextSchema>;
export type PhotoText = z.output<typeof photoTextSchema>;
