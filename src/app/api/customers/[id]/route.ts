import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { idFrom, outcomeResponse, parsePatch, type IdParams } from '@/lib/http/kit';
import { customerFormValues, getCustomer, getCustomerDetail, updateCustomer } from '@/lib/db/queries/customers';
import { errorResponse } from '@/lib/http/responses';
import { CustomerPatchControlSchema, CustomerSchema } from '@/lib/schemas/customer';

export const dynamic = 'force-dynamic';

/** One customer with their builds: any staff member. */
export async function GET(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter', 'tech');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'customer');
  if (id instanceof Response) return id;
  const customer = await getCustomerDetail(id);
  if (!customer) return errorResponse(404, `No customer with id ${id}.`);
  return NextResponse.json(customer);
}

/** Changes a customer. The body carries the `version` the form loaded; a stale one answers 409 with the current record. */
export async function PATCH(request: Request, context: IdParams) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const id = await idFrom(context, 'customer');
  if (id instanceof Response) return id;
  const current = await getCustomer(id);
  if (!current) return errorResponse(404, `No customer with id ${id}.`);
  const patch = await parsePatch(request, CustomerPatchControlSchema, CustomerSchema, customerFormValues(current));
  if (!patch.ok) return patch.response;
  return outcomeResponse(await updateCustomer(id, patch.control.version, patch.values, user), { label: 'customer' });
}
