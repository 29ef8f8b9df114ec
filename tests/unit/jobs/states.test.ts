import { canMove, illegalMoveMessage, JOB_STATES, nextStates, STATE_WORDS } from '@/lib/jobs/states';
import { signOffWarnings, type SignOffReadings } from '@/lib/jobs/sign-off-limits';
import { words } from '@/lib/jobs/build-words';
import { addDays, mondayOf, weekDays } from '@/lib/jobs/week';

describe('job states', () => {
  it('go one step forward, or one back, and never out of collected', () => {
    expect(canMove('not-booked', 'booked')).toBe(true);
    expect(canMove('booked', 'in-shop')).toBe(true);
    expect(canMove('booked', 'ready')).toBe(false);
    expect(canMove('in-shop', 'booked')).toBe(true);
    expect(canMove('on-dyno', 'collected')).toBe(false);
    expect(nextStates('collected')).toEqual([]);
    for (const s of JOB_STATES) expect(canMove('collected', s)).toBe(s === 'collected');
  });
  it('say where the job is in words and in its code when refusing', () => {
    expect(illegalMoveMessage('booked', 'ready')).toBe(
      'This job is booked (booked); it cannot go to ready to collect (ready). From here it can go to: in the shop.',
    );
    for (const word of Object.values(STATE_WORDS)) expect(word).not.toMatch(/^[a-z]+(-[a-z]+)*$/);
  });
});

describe('sign-off warnings (limits from memory)', () => {
  const ok: SignOffReadings = {
    ptvIntakeIn: 0.08,
    ptvExhaustIn: 0.1,
    springInstalledHeightIn: 1.8,
    springSeatPressureLb: 130,
    coilBindMarginIn: 0.06,
    pushrodLengthIn: 7.4,
    lifterPreloadIn: 0.05,
    deactivationDeleteDone: null,
  };
  it('are silent exactly at the usual minimums', () => expect(signOffWarnings(ok)).toEqual([]));
  it('name each reading just under or outside its limit', () => {
    const bad = {
      ...ok,
      ptvIntakeIn: 0.079,
      ptvExhaustIn: 0.099,
      coilBindMarginIn: 0.059,
      springSeatPressureLb: 210,
      springInstalledHeightIn: 1.95,
      pushrodLengthIn: 9.5,
      lifterPreloadIn: 0.2,
      deactivationDeleteDone: false,
    };
    expect(signOffWarnings(bad).map((w) => w.field)).toEqual([
      'ptvIntakeIn',
      'ptvExhaustIn',
      'springInstalledHeightIn',
      'springSeatPressureLb',
      'coilBindMarginIn',
      'pushrodLengthIn',
      'lifterPreloadIn',
      'deactivationDeleteDone',
    ]);
  });
});

describe('build sheet words and week arithmetic', () => {
  it('turn codes into words', () => {
    expect(words.heads('aluminum')).toBe('Aluminium heads');
    expect(words.exhaust('full-with-cats')).toBe('Full exhaust with catalytic converters');
  });
  it('start weeks on Monday across a month end', () => {
    expect(mondayOf('2027-03-03')).toBe('2027-03-01'); // a Wednesday
    expect(mondayOf('2027-02-28')).toBe('2027-02-22'); // a Sunday
    expect(weekDays('2027-03-29').at(-1)).toBe('2027-04-04');
    expect(addDays('2027-10-31', 1)).toBe('2027-11-01');
  });
});
