import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { shopSettings as settingsTable } from '../../db/schema';
import { defaultShopSettings, shopSettings, type ShopSettings } from '../../features/settings/schema';

/** The shop's settings; a shop that never saved any gets the defaults. Stored values pass the schema again on read. */
export async function getShopSettings(db: Pick<Db, 'select' | 'query'>, shopId: string): Promise<ShopSettings> {
  const row = await db.query.shopSettings.findFirst({ where: eq(settingsTable.shopId, shopId) });
  if (!row) return defaultShopSettings;
  const parsed = shopSettings.safeParse({ ...defaultShopSettings, ...(row.settings as object) });
  return parsed.success ? parsed.data : defaultShopSettings;
}

export async function saveShopSettings(db: Db, shopId: string, settings: ShopSettings): Promise<ShopSettings> {
  await db
    .insert(settingsTable)
    .values({ shopId, settings })
    .onConflictDoUpdate({ target: settingsTable.shopId, set: { settings, updatedAt: new Date() } });
  return settings;
}
