import request from 'supertest';
import { readRuntime } from '../support/runtime';

// The README sends people to the seeded quotes' customer links: they must open (the seeded tokens were once
// shorter than the 20 characters a link token needs, so both answered 404).
const { appUrl } = readRuntime();

describe('the demo quotes’ customer links named in the README', () => {
  it.each([
    ['demo-quote-whitlock-link-2026', 'Q-2026-0101'],
    ['demo-quote-okafor-link-2026', 'Q-2026-0102'],
  ])('/q/%s opens quote %s', async (token, number) => {
    const page = await request(appUrl).get(`/q/${token}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain(number);
  });
});
