import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { outcomeResponse, parseBody } from '@/lib/http/kit';
import { createRule, listRules } from '@/lib/db/queries/rules';
import { NeedRuleSchema } from '@/lib/schemas/need-rule';

export const dynamic = 'force-dynamic';

/** Every need rule with its items: any staff member (the quote builder reads them too). */
export async function GET(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const rules = await listRules();
  return NextResponse.json({ items: rules, total: rules.length });
}

export async function POST(request: Request) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const body = await parseBody(request, NeedRuleSchema);
  if (!body.ok) return body.response;
  return outcomeResponse(await createRule(body.value, user), { status: 201, label: 'rule' });
}
