import { NextResponse } from 'next/server';
import { getRule, removeRule, ruleFormValues, updateRule } from '@/lib/db/queries/rules';
import { notFound } from '@/lib/http/errors';
import { outcomeResponse } from '@/lib/http/kit';
import { readPatch } from '@/lib/http/parse';
import { route } from '@/lib/http/route';
import { NeedRulePatchControlSchema, NeedRuleSchema } from '@/lib/schemas/need-rule';

export const GET = route({ permission: 'catalogue.read', ids: { id: 'rule' } }, async ({ ids }) => {
  const rule = await getRule(ids.id);
  if (!rule) throw notFound('rule', ids.id);
  return NextResponse.json(rule);
});

/** The body is read after the lookup: a missing rule is 404 whatever the body says. */
export const PATCH = route({ permission: 'catalogue.write', ids: { id: 'rule' } }, async ({ request, user, ids }) => {
  const current = await getRule(ids.id);
  if (!current) throw notFound('rule', ids.id);
  const patch = await readPatch(request, NeedRulePatchControlSchema, NeedRuleSchema, ruleFormValues(current));
  return outcomeResponse(await updateRule(ids.id, patch.control.version, patch.values, user), { label: 'rule' });
});

export const DELETE = route({ permission: 'catalogue.write', ids: { id: 'rule' } }, async ({ user, ids }) =>
  outcomeResponse(await removeRule(ids.id, user), { label: 'rule', present: (r) => ({ outcome: 'deleted', rule: r }) }),
);
