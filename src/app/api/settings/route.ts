import { NextResponse } from 'next/server';
import { getShopSettingsRecord, settingsFormValues, updateShopSettings } from '@/lib/db/queries/settings';
import { HttpError } from '@/lib/http/errors';
import { outcomeResponse } from '@/lib/http/kit';
import { readPatch } from '@/lib/http/parse';
import { route } from '@/lib/http/route';
import { SettingsPatchControlSchema, ShopSettingsSchema } from '@/lib/schemas/settings';

async function storedSettings() {
  const settings = await getShopSettingsRecord();
  if (!settings) throw new HttpError(404, 'The shop has no settings yet; run the seed or migrations.');
  return settings;
}

export const GET = route({ permission: 'settings.manage' }, async () => NextResponse.json(await storedSettings()));

export const PATCH = route({ permission: 'settings.manage' }, async ({ request, user }) => {
  const patch = await readPatch(
    request,
    SettingsPatchControlSchema,
    ShopSettingsSchema,
    settingsFormValues(await storedSettings()),
  );
  return outcomeResponse(await updateShopSettings(patch.control.version, patch.values, user), { label: 'settings' });
});
