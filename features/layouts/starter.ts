import type { CheckSettings, Layout, LayoutInput } from '../../geometry';
// Deep imports keep the screens that start a layout from loading the whole geometry library.
import { LAYOUT_SCHEMA_VERSION } from '../../geometry/layoutSchema';
import { defaultShopSettings, type ShopSettings } from '../settings/schema';

/**
 * A new layout: a 32 x 40 in outer edge (a standard sheet, common practice),
 * the shop's first two stock boards as top and lower mat, and no openings yet.
 */
export function starterLayout(settings: ShopSettings): LayoutInput {
  const boards = (settings.stock.length > 0 ? settings.stock : defaultShopSettings.stock).slice(0, 2);
  const sheet = settings.sheets[0] ?? { widthIn: 32, heightIn: 40 };
  return {
    schemaVersion: LAYOUT_SCHEMA_VERSION,
    outer: { width: Math.min(32, sheet.widthIn), height: Math.min(40, sheet.heightIn) },
    mats: boards.map((b, i) => ({
      id: `mat-${i + 1}`,
      name: b.name,
      color: b.colour,
      coreColor: b.coreColour,
      ply: b.ply === 2 ? 'other' : b.ply,
      thickness: b.thicknessIn,
      bevelAngle: settings.bevelAngleDeg,
      sheet: { width: sheet.widthIn, height: sheet.heightIn },
    })),
    mountingBoard: { color: '#FFFFFF', cut: false },
    openings: [],
    checkSettings: { ...shopCheckLimits(settings), minimumOverlap: 1 / 8, rabbetAllowance: 1 / 8 },
  };
}

/** The shop's own limits for the checks: they are shop policy, set once in the settings. */
function shopCheckLimits(settings: ShopSettings): Pick<CheckSettings, 'bridgeWarning' | 'bridgeError' | 'minimumBand'> {
  return { bridgeWarning: settings.bridgeWarnIn, bridgeError: settings.bridgeErrorIn, minimumBand: settings.minVisibleBandIn };
}

/**
 * A draft opened for editing follows the shop's current limits, so changing
 * the settings changes what every working layout is checked against; a
 * frozen version keeps the limits it was approved with.
 */
export function withShopCheckLimits(layout: Layout, settings: ShopSettings): Layout {
  return { ...layout, checkSettings: { ...layout.checkSettings, ...shopCheckLimits(settings) } };
}
