import 'server-only';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { conflict, notFound, runWrite, type WriteOutcome } from '@/lib/db/write';
import type { AirUnits } from '@/lib/dyno/units';
import { SHOP_SETTINGS_FIELDS, type ShopSettingsValues } from '@/lib/schemas/settings';
import { ShopSettings } from '../models';

export async function getShopSettings(): Promise<ShopSettings | null> {
  return ShopSettings.findOne({ order: [['id', 'ASC']] });
}

/** The units the job page's dyno form and run table use; the default when there is no settings row yet. */
export async function getDynoAirUnits(): Promise<AirUnits> {
  return (await getShopSettings())?.dynoAirUnits ?? 'imperial';
}

/** The shop's name for page chrome; the shell must render even while the database is away. */
export async function getShopNameOrNull(): Promise<string | null> {
  try {
    return (await getShopSettings())?.name ?? null;
  } catch {
    return null;
  }
}

// ---- The manager's settings screen (issue 5): labour rate, tax rate, deposit policy. ----

export type ShopSettingsRecord = {
  id: number;
  name: string;
  address: string;
  phone: string;
  email: string;
  laborRateCents: number;
  taxRateBp: number;
  depositPercentBp: number;
  depositMinCents: number;
  depositMaxCents: number;
  depositPolicyText: string;
  /** The largest discount counter staff may give, as a share of the job before tax (basis points). */
  maxCounterDiscountBp: number;
  /** A new lead untouched for this many days is flagged on the leads list and the staff home page. */
  leadStaleDays: number;
  /** How the job page asks for and shows a dyno run's air; runs are stored in °C and kPa either way. */
  dynoAirUnits: AirUnits;
  currency: string;
  version: number;
  updatedAt: string;
};

export function toShopSettingsRecord(s: ShopSettings): ShopSettingsRecord {
  return {
    id: s.id,
    name: s.name,
    address: s.address,
    phone: s.phone,
    email: s.email,
    laborRateCents: s.laborRateCents,
    taxRateBp: s.taxRateBp,
    depositPercentBp: s.depositPercentBp,
    depositMinCents: s.depositMinCents,
    depositMaxCents: s.depositMaxCents,
    depositPolicyText: s.depositPolicyText,
    maxCounterDiscountBp: s.maxCounterDiscountBp,
    leadStaleDays: s.leadStaleDays,
    dynoAirUnits: s.dynoAirUnits,
    currency: s.currency,
    version: s.version,
    updatedAt: new Date(s.updatedAt).toISOString(),
  };
}

/** The stored settings as the form's values: what a PATCH body is laid over before the whole record is checked again. */
export function settingsFormValues(settings: ShopSettingsRecord): Record<string, unknown> {
  return Object.fromEntries(SHOP_SETTINGS_FIELDS.map((f) => [f, settings[f]]));
}

export async function getShopSettingsRecord(): Promise<ShopSettingsRecord | null> {
  const settings = await getShopSettings();
  return settings ? toShopSettingsRecord(settings) : null;
}

/** Saves the settings when the client's version is current; 409 with the current values otherwise. */
export async function updateShopSettings(
  expectedVersion: number,
  values: ShopSettingsValues,
  user: SessionUser,
): Promise<WriteOutcome<ShopSettingsRecord>> {
  return runWrite(
    async (t) => {
      const settings = await ShopSettings.findOne({ order: [['id', 'ASC']], transaction: t, lock: t.LOCK.UPDATE });
      if (!settings) throw notFound();
      const before = toShopSettingsRecord(settings);
      if (settings.version !== expectedVersion) throw conflict(before);
      settings.set(values);
      if (!settings.changed()) return { record: before, changed: false };
      await settings.save({ transaction: t });
      const after = toShopSettingsRecord(settings);
      await recordAudit(
        { user, action: 'settings.updated', entityType: 'shop_settings', entityId: String(settings.id), before, after },
        t,
      );
      return { record: after };
    },
    { reload: getShopSettingsRecord },
  );
}
