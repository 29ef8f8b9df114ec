import { NextResponse } from 'next/server';
import { createRule, listRules } from '@/lib/db/queries/rules';
import { outcomeResponse } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { NeedRuleSchema } from '@/lib/schemas/need-rule';

/** Every need rule with its items: any staff member (the quote builder reads them too). */
export const GET = route({ permission: 'catalogue.read' }, async () => {
  const rules = await listRules();
  return NextResponse.json({ items: rules, total: rules.length });
});

export const POST = route({ permission: 'catalogue.write', body: NeedRuleSchema }, async ({ user, body }) =>
  outcomeResponse(await createRule(body, user), { status: 201, label: 'rule' }),
);
