import { z } from 'zod';
import { presence } from './cam-card';
import { text } from './text';

// A note in a lead's log: what was said on the phone, at the counter, by e-mail.
export const LEAD_NOTE_LIMITS = { bodyMaxLength: 2000 } as const;

export const LeadNoteSchema = z.strictObject(
  {
    body: text('body', { multiline: true, error: presence('body', 'text') })
      .min(1, { error: 'body must say what was said' })
      .max(LEAD_NOTE_LIMITS.bodyMaxLength, {
        error: `body must be at most ${LEAD_NOTE_LIMITS.bodyMaxLength} characters`,
      }),
  },
  { error: presence('body', 'an object') },
);
export type LeadNoteInput = z.output<typeof LeadNoteSchema>;
