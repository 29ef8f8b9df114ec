import request from 'supertest';
import { readRuntime } from './runtime';

/**
 * Sends the public questionnaire for a stock 5.3 L daily driver in `name`'s name, with an e-mail made from
 * `emailTag` and the first word of the name (each file passes its own tag so the per-contact limit never
 * joins two files), and answers the new lead's id.
 */
export async function postTestLead(name: string, emailTag: string): Promise<number> {
  const sent = await request(readRuntime().appUrl)
    .post('/api/leads')
    .send({
      engine: '5.3',
      use: 'daily',
      idle: 'smooth',
      emissions: 'no',
      transmission: 'automatic',
      driveline: 'stock',
      exhaust: 'stock',
      budget: 'unsure',
      name,
      email: `${emailTag}-${name.split(' ')[0].toLowerCase()}@example.com`,
      consent: true,
    });
  if (sent.status !== 201) throw new Error(`lead fixture answered ${sent.status}: ${JSON.stringify(sent.body)}`);
  return sent.body.id;
}
