import request from 'supertest';
import { ShopSettings } from '@/lib/db/models';
import { connectTestDatabase, disconnectTestDatabase } from '../support/database';
import { readRuntime } from '../support/runtime';

const { appUrl } = readRuntime();

describe('landing page', () => {
  beforeAll(() => connectTestDatabase());
  afterAll(() => disconnectTestDatabase());

  it('says what Lobewise is and shows the shop name from settings in the footer', async () => {
    const settings = await ShopSettings.findOne();
    expect(settings).not.toBeNull();
    const response = await request(appUrl).get('/').expect(200);
    expect(response.headers['content-type']).toContain('text/html');
    expect(response.text).toContain('Lobewise');
    expect(response.text).toContain('Pick the right cam');
    // React escapes "&" in text; compare the escaped form of the name we read from the database.
    const escapedName = settings!.name.replace(/&/g, '&amp;');
    expect(response.text).toContain(escapedName);
    expect(response.text).toContain('href="/sign-in"');
  });

  it('answers an unknown page with our own 404', async () => {
    const response = await request(appUrl).get('/no-such-page').expect(404);
    expect(response.text).toContain('That page isn’t here');
  });
});
