import { NextResponse } from 'next/server';
import { requireRole } from '@/lib/auth/guard';
import { outcomeResponse, parsePatch } from '@/lib/http/kit';
import { getShopSettingsRecord, updateShopSettings } from '@/lib/db/queries/settings';
import { errorResponse } from '@/lib/http/responses';
import { SettingsPatchControlSchema, SHOP_SETTINGS_FIELDS, ShopSettingsSchema } from '@/lib/schemas/settings';

export const dynamic = 'force-dynamic';

const missing = () => errorResponse(404, 'The shop has no settings yet; run the seed or migrations.');

export async function GET(request: Request) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const settings = await getShopSettingsRecord();
  return settings ? NextResponse.json(settings) : missing();
}

export async function PATCH(request: Request) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  const current = await getShopSettingsRecord();
  if (!current) return missing();
  const values = Object.fromEntries(SHOP_SETTINGS_FIELDS.map((f) => [f, current[f]]));
  const patch = await parsePatch(request, SettingsPatchControlSchema, ShopSettingsSchema, values);
  if (!patch.ok) return patch.response;
  return outcomeResponse(await updateShopSettings(patch.control.version, patch.values, user), { label: 'settings' });
}
