/**
 * The shipping box and its weights for a finished frame. Lengths come in as
 * inches (the geometry's unit); the answer is in the shop's shipping units,
 * inches and pounds or centimetres and kilograms. Pure: no I/O, no state.
 */
import { MILLIMETRES_PER_INCH } from './units';

export type ShippingUnits = 'in/lb' | 'cm/kg';

/** Exact by definition (international pound of 1959, NIST Handbook 44 Appendix C). */
export const KILOGRAMS_PER_POUND = 0.45359237;
const SQUARE_METRES_PER_SQUARE_INCH = (MILLIMETRES_PER_INCH / 1000) ** 2;
const SQUARE_INCHES_PER_SQUARE_FOOT = 144;

/** The shop's shipping rules, every value in its own units (lengths in in or cm, weights per sq ft or per m2). */
export interface ShippingRules {
  units: ShippingUnits;
  /** Padding on each side of the frame, in the length unit. */
  padding: number;
  /** Dimensional divisor: L x W x H / divisor gives a weight (139 for in/lb, 5000 for cm/kg). */
  divisor: number;
  /** One mat board per area: lb per sq ft, or kg per m2. */
  matBoardWeight: number;
  mountingBoardWeight: number;
  /** The carton per area of its surface: lb per sq ft, or kg per m2. */
  boxWeight: number;
}

export interface GlazingSheet {
  thicknessIn: number;
  /** kg per cubic metre. */
  densityKgM3: number;
}

export interface FrameForShipping {
  /** The layout's outer size: the mats, the glazing and the mounting board are this size. */
  outerWidthIn: number;
  outerHeightIn: number;
  matCount: number;
  mouldingFaceWidthIn: number;
  mouldingRabbetDepthIn: number;
  mouldingWeightLbPerFoot: number;
  /** 0 for a flat frame. */
  shadowboxDepthIn: number;
}

export interface ShippingEstimate {
  units: ShippingUnits;
  /** Frame outside size, in the length unit. */
  frame: { width: number; height: number; depth: number };
  /** Inside of the box: frame plus padding on each side, in the length unit (not rounded). */
  box: { length: number; width: number; depth: number };
  /** The box's sides rounded up to the whole unit, as carriers measure them. */
  boxRounded: { length: number; width: number; depth: number };
  /** Weights in the weight unit. */
  weights: { glazing: number; mats: number; mounting: number; moulding: number; box: number; packed: number };
  dimensional: number;
  /** The larger of packed and dimensional, rounded up to the whole pound or kilogram. */
  billed: number;
  /** What hangs on the wall: packed weight less the box. */
  hanging: number;
}

/** Mass per area of a glazing sheet in kg/m2: density x thickness. */
export function glazingKgPerSquareMetre(sheet: GlazingSheet): number {
  return sheet.densityKgM3 * (sheet.thicknessIn * MILLIMETRES_PER_INCH) / 1000;
}

/** Length unit per inch for the shop's units. */
const lengthPerInch = (units: ShippingUnits) => (units === 'in/lb' ? 1 : MILLIMETRES_PER_INCH / 10);
/** Weight unit per kilogram. */
const weightPerKg = (units: ShippingUnits) => (units === 'in/lb' ? 1 / KILOGRAMS_PER_POUND : 1);
/** An area in square inches, in the area unit the shop's weights are per (sq ft or m2). */
const areaInRuleUnit = (units: ShippingUnits, sqIn: number) =>
  units === 'in/lb' ? sqIn / SQUARE_INCHES_PER_SQUARE_FOOT : sqIn * SQUARE_METRES_PER_SQUARE_INCH;

/** L x W x H / divisor with each side rounded up to the whole unit (carriers' billable-weight rule). */
export function dimensionalWeight(sides: { length: number; width: number; depth: number }, divisor: number): number {
  if (!(divisor > 0)) throw new RangeError(`dimensionalWeight needs a positive divisor, got ${divisor}`);
  return (Math.ceil(sides.length) * Math.ceil(sides.width) * Math.ceil(sides.depth)) / divisor;
}

/** The weight a carrier bills: the larger of the two, rounded up to the whole unit. */
export function billedWeight(actual: number, dimensional: number): number {
  return Math.ceil(actual > dimensional ? actual : dimensional);
}

/** The mitred frame's centre line: each side is its inner length plus one face width. */
export function mouldingCentreLineIn(frame: Pick<FrameForShipping, 'outerWidthIn' | 'outerHeightIn' | 'mouldingFaceWidthIn'>): number {
  return 2 * (frame.outerWidthIn + frame.outerHeightIn) + 4 * frame.mouldingFaceWidthIn;
}

/** Rounds a shown figure to two decimals so screens and tests agree. */
const tidy = (n: number) => Math.round(n * 100) / 100;

/** The box, its packed, dimensional and billed weights for one glazing. */
export function shippingEstimate(frame: FrameForShipping, glazing: GlazingSheet, rules: ShippingRules): ShippingEstimate {
  const perInch = lengthPerInch(rules.units);
  const faceIn = frame.mouldingFaceWidthIn;
  const depthIn = frame.shadowboxDepthIn > frame.mouldingRabbetDepthIn ? frame.shadowboxDepthIn : frame.mouldingRabbetDepthIn;
  const frameSize = { width: (frame.outerWidthIn + 2 * faceIn) * perInch, height: (frame.outerHeightIn + 2 * faceIn) * perInch, depth: depthIn * perInch };
  const box = { length: frameSize.width + 2 * rules.padding, width: frameSize.height + 2 * rules.padding, depth: frameSize.depth + 2 * rules.padding };
  // Carriers put the longer side first.
  if (box.width > box.length) [box.length, box.width] = [box.width, box.length];
  const rounded = { length: Math.ceil(box.length), width: Math.ceil(box.width), depth: Math.ceil(box.depth) };

  const toWeight = weightPerKg(rules.units);
  const outerSqIn = frame.outerWidthIn * frame.outerHeightIn;
  const outerArea = areaInRuleUnit(rules.units, outerSqIn);
  const glazingWeight = glazingKgPerSquareMetre(glazing) * outerSqIn * SQUARE_METRES_PER_SQUARE_INCH * toWeight;
  const matsWeight = rules.matBoardWeight * outerArea * frame.matCount;
  const mountingWeight = rules.mountingBoardWeight * outerArea;
  const mouldingWeight = (mouldingCentreLineIn(frame) / 12) * frame.mouldingWeightLbPerFoot * KILOGRAMS_PER_POUND * toWeight;
  // The box's surface from its sides in the length unit, back to square inches for the area unit.
  const surfaceSqIn = (2 * (box.length * box.width + box.length * box.depth + box.width * box.depth)) / (perInch * perInch);
  const boxWeight = rules.boxWeight * areaInRuleUnit(rules.units, surfaceSqIn);
  const hanging = glazingWeight + matsWeight + mountingWeight + mouldingWeight;
  const packed = hanging + boxWeight;
  const dimensional = dimensionalWeight(box, rules.divisor);

  return {
    units: rules.units,
    frame: { width: tidy(frameSize.width), height: tidy(frameSize.height), depth: tidy(frameSize.depth) },
    box: { length: tidy(box.length), width: tidy(box.width), depth: tidy(box.depth) },
    boxRounded: rounded,
    weights: { glazing: tidy(glazingWeight), mats: tidy(matsWeight), mounting: tidy(mountingWeight), moulding: tidy(mouldingWeight), box: tidy(boxWeight), packed: tidy(packed) },
    dimensional: tidy(dimensional),
    billed: billedWeight(packed, dimensional),
    hanging: tidy(hanging),
  };
}
