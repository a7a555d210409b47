import { Router } from 'express';
import { shopSettings, type ShopSettings } from '../../features/settings/schema';
import { currentMember, requireMember } from '../auth';
import type { Db } from '../../db/client';
import { HttpError, parseOr400 } from '../errors';
import { getShopSettings, saveShopSettings } from '../services/settings';

function assertUniqueIds(list: { id: string }[], field: string, key = 'id') {
  const seen = new Set<string>();
  for (const [i, item] of list.entries()) {
    if (seen.has(item.id)) throw new HttpError(400, 'invalid_input', `Two entries share one ${key === 'id' ? 'id' : 'entry'}`, { [`${field}.${i}.${key}`]: key === 'id' ? 'This id is used twice' : 'This is listed twice' });
    seen.add(item.id);
  }
}

/** Each moulding code, glazing kind and (ply, sheet) board price once, and board prices only for listed sheets. */
function assertPricesReadable(settings: ShopSettings) {
  assertUniqueIds(settings.mouldings.map((m) => ({ id: m.code })), 'mouldings', 'code');
  assertUniqueIds(settings.glazing.map((g) => ({ id: g.kind })), 'glazing', 'kind');
  assertUniqueIds(settings.priceList.matBoards.map((b) => ({ id: `${b.ply} ${b.sheetName}` })), 'priceList.matBoards', 'sheetName');
  const sheetNames = new Set(settings.sheets.map((s) => s.name));
  settings.priceList.matBoards.forEach((b, i) => {
    if (!sheetNames.has(b.sheetName)) {
      throw new HttpError(400, 'invalid_input', 'A board price names a sheet size the shop does not list', { [`priceList.matBoards.${i}.sheetName`]: `No sheet size is named ${b.sheetName}` });
    }
  });
}

export function settingsRoutes(db: Db): Router {
  const router = Router();

  // Everyone in the shop reads the settings: the designer needs the stock and the checks' limits.
  router.get('/', requireMember(), async (_req, res) => {
    res.json({ settings: await getShopSettings(db, currentMember(res.locals).shopId) });
  });

  router.put('/', requireMember('owner'), async (req, res) => {
    const settings = parseOr400(shopSettings, req.body);
    assertUniqueIds(settings.stock, 'stock');
    assertUniqueIds(settings.cutterProfiles, 'cutterProfiles');
    assertPricesReadable(settings);
    res.json({ settings: await saveShopSettings(db, currentMember(res.locals).shopId, settings) });
  });

  return router;
}
