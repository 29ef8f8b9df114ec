import request from 'supertest';
import packageJson from '../../package.json';
import { readRuntime } from '../support/runtime';

const { appUrl } = readRuntime();

describe('GET /api/health', () => {
  it('reports the database up and the package version', async () => {
    const response = await request(appUrl).get('/api/health').expect(200);
    expect(response.body).toEqual({ status: 'ok', db: 'up', version: packageJson.version });
  });

  it('sends the security headers on every response', async () => {
    const response = await request(appUrl).get('/api/health');
    expect(response.headers['x-frame-options']).toBe('DENY');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['referrer-policy']).toBe('strict-origin-when-cross-origin');
    expect(response.headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(response.headers['x-powered-by']).toBeUndefined();
  });
});
