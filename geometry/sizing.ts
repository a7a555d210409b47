import type { Size } from './layoutSchema';
import { inchesFromMillimetres } from './units';

/**
 * Sizes a framer works out before drawing anything. All sizes in inches,
 * width across and height down.
 */

/** Common practice: the mat package is cut 1/8 in smaller than the frame's rabbet. */
export const RABBET_ALLOWANCE_IN = 1 / 8;

/** The sight opening for a flat piece the mat overlaps by `overlap` on every side. */
export function openingForPiece(piece: Size, overlap: number): Size {
  return { width: piece.width - 2 * overlap, height: piece.height - 2 * overlap };
}

/** The largest mat package that drops into a frame's rabbet. */
export function outerFromRabbet(rabbet: Size, allowance: number = RABBET_ALLOWANCE_IN): Size {
  return { width: rabbet.width - allowance, height: rabbet.height - allowance };
}

/**
 * Moulding to order for a frame around `size`: the perimeter plus eight
 * moulding widths, since each of the four mitred corners uses about two
 * widths of stick.
 */
export function mouldingLength(size: Size, mouldingWidth: number): number {
  return 2 * (size.width + size.height) + 8 * mouldingWidth;
}

/** United inches, the trade's size measure for pricing: width plus height. */
export function unitedInches(size: Size): number {
  return size.width + size.height;
}

export interface PiecePreset {
  readonly id: string;
  readonly label: string;
  readonly size: Size;
}

function millimetreSize(width: number, height: number): Size {
  return { width: inchesFromMillimetres(width), height: inchesFromMillimetres(height) };
}

/** Standard piece sizes, portrait (width no larger than height). */
export const PIECE_PRESETS: readonly PiecePreset[] = [
  { id: 'photo-4x6', label: '4 x 6 photo', size: { width: 4, height: 6 } },
  { id: 'photo-5x7', label: '5 x 7 photo', size: { width: 5, height: 7 } },
  { id: 'photo-8x10', label: '8 x 10 photo', size: { width: 8, height: 10 } },
  { id: 'photo-11x14', label: '11 x 14 photo', size: { width: 11, height: 14 } },
  { id: 'iso-a5', label: 'A5', size: millimetreSize(148, 210) },
  { id: 'iso-a4', label: 'A4', size: millimetreSize(210, 297) },
  { id: 'iso-a3', label: 'A3', size: millimetreSize(297, 420) },
  { id: 'ansi-letter', label: 'Letter', size: { width: 8.5, height: 11 } },
  { id: 'ansi-legal', label: 'Legal', size: { width: 8.5, height: 14 } },
  { id: 'ansi-tabloid', label: 'Tabloid', size: { width: 11, height: 17 } },
];

export function piecePreset(id: string): PiecePreset | undefined {
  return PIECE_PRESETS.find((preset) => preset.id === id);
}
