import { NextResponse } from 'next/server';
import { createCustomer, listCustomers } from '@/lib/db/queries/customers';
import { outcomeResponse, paged } from '@/lib/http/kit';
import { route } from '@/lib/http/route';
import { CustomerListQuerySchema, CustomerSchema } from '@/lib/schemas/customer';

/** Customer search (name, e-mail, phone), paged. */
export const GET = route({ permission: 'customers.read', query: CustomerListQuerySchema }, async ({ query }) => {
  const { items, total } = await listCustomers(query);
  return NextResponse.json(paged(items, total, query.page, query.pageSize));
});

export const POST = route({ permission: 'customers.write', body: CustomerSchema }, async ({ user, body }) =>
  outcomeResponse(await createCustomer(body, user), { status: 201, label: 'customer' }),
);
