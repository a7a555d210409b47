import { describe, expect, it } from 'vitest';
import { parseLayout } from '../../geometry';
import { defaultShopSettings } from '../settings/schema';
import { starterLayout, withShopCheckLimits } from './starter';

describe('starter layout and shop limits', () => {
  it("a new layout is a valid 32 x 40 in document (a standard sheet, common practice) with the shop's limits", () => {
    const parsed = parseLayout(starterLayout(defaultShopSettings));
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    expect(parsed.layout.outer).toEqual({ width: 32, height: 40 });
    // Common practice: bridge 1/2 in warning, 1/4 in error; 1/16 in smallest band.
    expect(parsed.layout.checkSettings).toMatchObject({ bridgeWarning: 0.5, bridgeError: 0.25, minimumBand: 0.0625 });
  });

  it("an opened draft takes the shop's current limits and keeps its other check settings", () => {
    const parsed = parseLayout(starterLayout(defaultShopSettings));
    if (!parsed.ok) throw new Error('starter layout did not parse');
    const stricter = { ...defaultShopSettings, bridgeWarnIn: 0.75, bridgeErrorIn: 0.375, minVisibleBandIn: 0.125 };
    const opened = withShopCheckLimits(parsed.layout, stricter);
    expect(opened.checkSettings).toEqual({ ...parsed.layout.checkSettings, bridgeWarning: 0.75, bridgeError: 0.375, minimumBand: 0.125 });
    expect(opened.openings).toBe(parsed.layout.openings);
  });
});
