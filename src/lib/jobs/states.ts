// A job's progress through the workshop, in the shop's own words. Pure: shared by the API, the board
// and the tests. "Not booked" is not stored: a paid quote without a job row is waiting to be booked.

export const JOB_STATES = ['booked', 'in-shop', 'on-dyno', 'ready', 'collected'] as const;
export type JobState = (typeof JOB_STATES)[number];
export type BoardState = JobState | 'not-booked';

export const STATE_WORDS: Record<BoardState, string> = {
  'not-booked': 'Not booked yet',
  booked: 'Booked',
  'in-shop': 'In the shop',
  'on-dyno': 'On the dyno',
  ready: 'Ready to collect',
  collected: 'Collected',
};

export const STATE_TONES: Record<BoardState, 'ok' | 'caution' | 'fault' | 'muted'> = {
  'not-booked': 'caution',
  booked: 'muted',
  'in-shop': 'caution',
  'on-dyno': 'caution',
  ready: 'ok',
  collected: 'muted',
};

// One step forward, or one step back when work has to be redone (a leak found on the dyno sends the car
// back into the shop). Collected is the end: a car that comes back is a new job.
const MOVES: Record<BoardState, readonly JobState[]> = {
  'not-booked': ['booked'],
  booked: ['in-shop'],
  'in-shop': ['on-dyno', 'booked'],
  'on-dyno': ['ready', 'in-shop'],
  ready: ['collected', 'on-dyno'],
  collected: [],
};

export function nextStates(from: BoardState): readonly JobState[] {
  return MOVES[from];
}

export function canMove(from: BoardState, to: JobState): boolean {
  return from === to || MOVES[from].includes(to);
}

/** The 409 message for a move the workshop does not allow, naming where the job is now. */
export function illegalMoveMessage(from: BoardState, to: JobState): string {
  const options = MOVES[from].map((s) => STATE_WORDS[s].toLowerCase());
  const next = options.length ? `From here it can go to: ${options.join(' or ')}.` : 'It cannot move any further.';
  return `This job is ${STATE_WORDS[from].toLowerCase()} (${from}); it cannot go to ${STATE_WORDS[to].toLowerCase()} (${to}). ${next}`;
}

/** The technician's sign-off is recorded while the engine is being built or run in. */
export const SIGN_OFF_STATES: readonly JobState[] = ['in-shop', 'on-dyno'];
