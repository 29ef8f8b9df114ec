import { db, ShopSettings } from '../models';

export async function getShopSettings(): Promise<ShopSettings | null> {
  db();
  return ShopSettings.findOne({ order: [['id', 'ASC']] });
}

/** The shop's name for page chrome; the shell must render even while the database is away. */
export async function getShopNameOrNull(): Promise<string | null> {
  try {
    return (await getShopSettings())?.name ?? null;
  } catch {
    return null;
  }
}
