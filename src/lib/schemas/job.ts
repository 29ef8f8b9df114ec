import { z } from 'zod';
import { JOB_STATES } from '@/lib/jobs/states';
import { presence } from './cam-card';
import { text } from './text';

// The job board (booking, bay, technician, state) and the technician's sign-off. Measurements are in
// inches and pounds, the shop's units. The hard limits here only refuse impossible readings (a typo);
// the safe-practice warnings live in src/lib/jobs/sign-off-limits.ts.
export const JOB_LIMITS = {
  // Bays the booking form offers; the shop's floor, not a rule of physics. Change here when it grows.
  bays: 6,
  pageSizeMax: 100,
  // A booking further out than this is almost certainly a mistyped year.
  bookAheadDays: 730,
  bookBackDays: 365,
  tuneFileMaxLength: 120,
  notesMaxLength: 2000,
} as const;

const wholeNumber = (label: string) =>
  z.number({ error: presence(label, 'a whole number') }).int({ error: `${label} must be a whole number` });

const DAY_MS = 86_400_000;
const bookingDate = z.iso.date({ error: 'bookedFor must be a date (YYYY-MM-DD)' }).refine(
  (d) => {
    const t = Date.parse(`${d}T12:00:00Z`);
    return t > Date.now() - JOB_LIMITS.bookBackDays * DAY_MS && t < Date.now() + JOB_LIMITS.bookAheadDays * DAY_MS;
  },
  { error: `bookedFor must be within ${JOB_LIMITS.bookBackDays} days back and ${JOB_LIMITS.bookAheadDays} days ahead` },
);

export const JobPatchSchema = z.strictObject(
  {
    // 0 for a paid job that has never been booked: the first save creates its booking.
    version: wholeNumber('version').min(0, { error: 'version must be 0 or more' }),
    bookedFor: bookingDate.optional(),
    bay: wholeNumber('bay')
      .min(1, { error: 'bay must be at least 1' })
      .max(JOB_LIMITS.bays, { error: `bay must be at most ${JOB_LIMITS.bays}` })
      .nullable()
      .optional(),
    technicianId: wholeNumber('technicianId')
      .min(1, { error: 'technicianId must be a staff id' })
      .nullable()
      .optional(),
    state: z.enum(JOB_STATES, { error: presence('state', `one of: ${JOB_STATES.join(', ')}`) }).optional(),
  },
  { error: presence('body', 'an object') },
);
export type JobPatch = z.output<typeof JobPatchSchema>;

export const JOB_VIEWS = ['active', 'collected', 'all'] as const;

export const JobListQuerySchema = z
  .strictObject({
    view: z.enum(JOB_VIEWS, { error: `view must be one of: ${JOB_VIEWS.join(', ')}` }).default('active'),
    from: z.iso.date({ error: 'from must be a date (YYYY-MM-DD)' }).optional(),
    to: z.iso.date({ error: 'to must be a date (YYYY-MM-DD)' }).optional(),
    page: z.coerce
      .number({ error: 'page must be a whole number' })
      .int({ error: 'page must be a whole number' })
      .min(1, { error: 'page must be at least 1' })
      .default(1),
    pageSize: z.coerce
      .number({ error: 'pageSize must be a whole number' })
      .int({ error: 'pageSize must be a whole number' })
      .min(1, { error: 'pageSize must be at least 1' })
      .max(JOB_LIMITS.pageSizeMax, { error: `pageSize must be at most ${JOB_LIMITS.pageSizeMax}` })
      .default(25),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { path: ['to'], error: 'to must be on or after from' });
export type JobListQuery = z.output<typeof JobListQuerySchema>;

/** A measurement in a unit, refused only when it cannot be a real reading. */
const reading = (label: string, unit: string, min: number, max: number) =>
  z
    .number({ error: presence(label, `a number (${unit})`) })
    .min(min, { error: `${label} must be at least ${min} ${unit}` })
    .max(max, { error: `${label} must be at most ${max} ${unit}` });

/**
 * What a sign-off reading may be at all (a typo otherwise), with its unit and its name in words (messages say
 * "coil-bind margin must be a number (in)", never the field's code); the form's yup checks and labels read these too.
 */
export const SIGN_OFF_READING_LIMITS = {
  ptvIntakeIn: { label: 'piston-to-valve, intake', unit: 'in', min: 0, max: 0.5 },
  ptvExhaustIn: { label: 'piston-to-valve, exhaust', unit: 'in', min: 0, max: 0.5 },
  springInstalledHeightIn: { label: 'spring installed height', unit: 'in', min: 1, max: 2.5 },
  springSeatPressureLb: { label: 'spring seat pressure', unit: 'lb', min: 20, max: 500 },
  coilBindMarginIn: { label: 'coil-bind margin', unit: 'in', min: 0, max: 0.5 },
  pushrodLengthIn: { label: 'pushrod length', unit: 'in', min: 4, max: 11 },
  lifterPreloadIn: { label: 'lifter preload', unit: 'in', min: 0, max: 0.25 },
} as const;
/** The other sign-off fields' names in messages. */
export const SIGN_OFF_WORDS = {
  tuneFile: 'tune file and version',
  deactivationDeleteDone: 'the cylinder-deactivation delete answer',
} as const;
const R = SIGN_OFF_READING_LIMITS;
const signOffReading = (key: keyof typeof R) => reading(R[key].label, R[key].unit, R[key].min, R[key].max);

export const SignOffSchema = z.strictObject(
  {
    ptvIntakeIn: signOffReading('ptvIntakeIn'),
    ptvExhaustIn: signOffReading('ptvExhaustIn'),
    springInstalledHeightIn: signOffReading('springInstalledHeightIn'),
    springSeatPressureLb: signOffReading('springSeatPressureLb'),
    coilBindMarginIn: signOffReading('coilBindMarginIn'),
    pushrodLengthIn: signOffReading('pushrodLengthIn'),
    lifterPreloadIn: signOffReading('lifterPreloadIn'),
    // Required by the route when the build has active cylinder deactivation; otherwise not asked.
    deactivationDeleteDone: z
      .boolean({ error: `${SIGN_OFF_WORDS.deactivationDeleteDone} must be true or false` })
      .optional(),
    tuneFile: text(SIGN_OFF_WORDS.tuneFile, { error: presence(SIGN_OFF_WORDS.tuneFile, 'text') })
      .min(1, { error: `${SIGN_OFF_WORDS.tuneFile} must name the tune loaded` })
      .max(JOB_LIMITS.tuneFileMaxLength, {
        error: `${SIGN_OFF_WORDS.tuneFile} must be at most ${JOB_LIMITS.tuneFileMaxLength} characters`,
      }),
    notes: text('notes', { multiline: true })
      .max(JOB_LIMITS.notesMaxLength, { error: `notes must be at most ${JOB_LIMITS.notesMaxLength} characters` })
      .optional()
      .transform((v) => (v ? v : undefined)),
  },
  { error: presence('body', 'an object') },
);
export type SignOffInput = z.output<typeof SignOffSchema>;

// The board page's address (/jobs?view=week&week=…): anything unreadable falls back to the default view
// instead of an error page, because these arrive from bookmarks and hand-typed links.
export const BoardPageQuerySchema = z.object({
  view: z.enum(['list', 'week']).catch('list'),
  show: z.enum(['active', 'collected']).catch('active'),
  week: z.iso.date().optional().catch(undefined),
  page: z.coerce.number().int().min(1).max(10_000).catch(1),
});
