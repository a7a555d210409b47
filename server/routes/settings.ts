import { Router } from 'express';
import { shopSettings } from '../../features/settings/schema';
import { currentMember, requireMember } from '../auth';
import type { Db } from '../../db/client';
import { HttpError, parseOr400 } from '../errors';
import { getShopSettings, saveShopSettings } from '../services/settings';

function assertUniqueIds(list: { id: string }[], field: string) {
  const seen = new Set<string>();
  for (const [i, item] of list.entries()) {
    if (seen.has(item.id)) throw new HttpError(400, 'invalid_input', 'Two entries share one id', { [`${field}.${i}.id`]: 'This id is used twice' });
    seen.add(item.id);
  }
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
    res.json({ settings: await saveShopSettings(db, currentMember(res.locals).shopId, settings) });
  });

  return router;
}
