import { translateQuery } from '@/lib/throttle/store';
import { pauseSeconds } from '@/lib/throttle/sign-in-limits';

describe('the rate-limit store adapter', () => {
  it('inlines ?? identifiers as quoted names and keeps ? values in order', () => {
    expect(
      translateQuery('SELECT points FROM ??.?? WHERE `key` = ? AND expire > ?', [
        'lobewise_test',
        'rate_limits',
        'k',
        5,
      ]),
    ).toEqual({
      sql: 'SELECT points FROM `lobewise_test`.`rate_limits` WHERE `key` = ? AND expire > ?',
      values: ['k', 5],
    });
    expect(translateQuery('DELETE FROM ??', ['we`ird']).sql).toBe('DELETE FROM `we``ird`');
  });
});

describe('sign-in pauses', () => {
  it('double each time, from 15 minutes up to a day', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8].map(pauseSeconds)).toEqual([900, 1800, 3600, 7200, 14400, 28800, 57600, 86400]);
    expect(pauseSeconds(20)).toBe(86400);
  });
});
