import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { idFrom, outcomeResponse, parsePatch, type IdParams } from '@/lib/http/kit';
import { getRule, removeRule, updateRule } from '@/lib/db/queries/rules';
import { errorResponse } from '@/lib/http/responses';
import { NeedRulePatchControlSchema, NeedRuleSchema } from '@/lib/schemas/need-rule';

export const dynamic = 'force-dynamic';

export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'rule');
  if (id instanceof Response) return id;
  const rule = await getRule(id);
  return rule ? NextResponse.json(rule) : errorResponse(404, `No rule with id ${id}.`);
}

export async function PATCH(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'rule');
  if (id instanceof Response) return id;
  const current = await getRule(id);
  if (!current) return errorResponse(404, `No rule with id ${id}.`);
  const values = {
    kind: current.kind,
    vehicleClass: current.vehicleClass,
    label: current.label,
    active: current.active,
    items: current.items.map((i) => ({ partId: i.partId, laborOperationId: i.laborOperationId, quantity: i.quantity })),
  };
  const patch = await parsePatch(request, NeedRulePatchControlSchema, NeedRuleSchema, values);
  if (!patch.ok) return patch.response;
  return outcomeResponse(await updateRule(id, patch.control.version, patch.values, user), { label: 'rule' });
}

export async function DELETE(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'rule');
  if (id instanceof Response) return id;
  return outcomeResponse(await removeRule(id, user), { label: 'rule', present: (r) => ({ outcome: 'deleted', rule: r }) });
}
