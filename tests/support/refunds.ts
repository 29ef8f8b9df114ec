import type request from 'supertest';

// A refund as the staff page posts it: with the quote's version as just read (the route refuses a stale one,
// so a double click refunds once). The rest of the body is the test's own.
type Agent = ReturnType<typeof request.agent>;
export type RefundBody = {
  amountCents: number;
  paymentId?: number;
  reason?: string;
  afterFullRefund?: string;
};

export async function postRefund(agent: Agent, quoteId: number, body: RefundBody) {
  const { version } = (await agent.get(`/api/quotes/${quoteId}`)).body as { version: number };
  return agent.post(`/api/quotes/${quoteId}/refund`).send({ version, ...body });
}
