import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { outcomeResponse, paged, parseBody, parseQuery } from '@/lib/http/kit';
import { createCustomer, listCustomers } from '@/lib/db/queries/customers';
import { CustomerListQuerySchema, CustomerSchema } from '@/lib/schemas/customer';

export const dynamic = 'force-dynamic';

/** Customer search (name, e-mail, phone), paged: any staff member. */
export async function GET(request: Request) {
  const user = await requireRole(request, 'manager', 'counter', 'tech');
  if (user instanceof Response) return user;
  const query = parseQuery(request, CustomerListQuerySchema);
  if (!query.ok) return query.response;
  const { items, total } = await listCustomers(query.value);
  return NextResponse.json(paged(items, total, query.value.page, query.value.pageSize));
}

/** A new customer: managers and counter staff. */
export async function POST(request: Request) {
  const user = await requireRole(request, 'manager', 'counter');
  if (user instanceof Response) return user;
  const body = await parseBody(request, CustomerSchema);
  if (!body.ok) return body.response;
  return outcomeResponse(await createCustomer(body.value, user), { status: 201, label: 'customer' });
}
