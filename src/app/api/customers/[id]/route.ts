import { NextResponse } from 'next/server';
import { customerFormValues, getCustomer, getCustomerDetail, updateCustomer } from '@/lib/db/queries/customers';
import { notFound } from '@/lib/http/errors';
import { outcomeResponse } from '@/lib/http/kit';
import { readPatch } from '@/lib/http/parse';
import { route } from '@/lib/http/route';
import { CustomerPatchControlSchema, CustomerSchema } from '@/lib/schemas/customer';

/** One customer with their builds. */
export const GET = route({ permission: 'customers.read', ids: { id: 'customer' } }, async ({ ids }) => {
  const customer = await getCustomerDetail(ids.id);
  if (!customer) throw notFound('customer', ids.id);
  return NextResponse.json(customer);
});

/** Changes a customer. The body carries the `version` the form loaded; a stale one answers 409 with the current record. */
export const PATCH = route(
  { permission: 'customers.write', ids: { id: 'customer' } },
  async ({ request, user, ids }) => {
    const current = await getCustomer(ids.id);
    if (!current) throw notFound('customer', ids.id);
    const patch = await readPatch(request, CustomerPatchControlSchema, CustomerSchema, customerFormValues(current));
    return outcomeResponse(await updateCustomer(ids.id, patch.control.version, patch.values, user), {
      label: 'customer',
    });
  },
);
