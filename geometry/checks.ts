import type { Layout } from './layoutSchema';
import type { Finding } from './findings';
import type { BridgeSpot } from './bridges';
import type { LayoutEngineOptions } from './engine';
import { createLayoutEngine } from './engine';

export type { Finding, FindingCode } from './findings';

/**
 * Every check a layout gets, from scratch. While a framer drags an opening,
 * hold one `createLayoutEngine()` instead so unchanged work is reused.
 */
export function checkLayout(layout: Layout, options: LayoutEngineOptions = {}): Finding[] {
  return createLayoutEngine(options).check(layout);
}

/**
 * The narrow bridges of each mat (narrower than the shop's warning width
 * plus a margin), measured on face-edge lines, narrowest first.
 */
export function matBridgeWidths(layout: Layout, options: LayoutEngineOptions = {}): BridgeSpot[] {
  return createLayoutEngine(options).bridges(layout);
}
