import { describe, expect, it } from 'vitest';
import { billedWeight, dimensionalWeight, glazingKgPerSquareMetre, KILOGRAMS_PER_POUND, mouldingCentreLineIn, shippingEstimate, type FrameForShipping, type ShippingRules } from './shipping';

// Reference values: REFERENCES.md "Glazing and shipping". 1 in = 25.4 mm and
// 1 lb = 0.45359237 kg exactly (NIST Handbook 44, Appendix C).
const MM = 25.4;
const LB = 0.45359237;
const SQ_FT_M2 = (12 * MM / 1000) ** 2; // 0.09290304 m2

const floatGlass = { thicknessIn: 2.5 / MM, densityKgM3: 2500 }; // EN 572-1 density, ASTM C1036 nominal 2.5 mm
const acrylic = { thicknessIn: 0.118, densityKgM3: 1190 }; // ASTM D792 specific gravity 1.19; 0.118 in is common practice

const inchRules: ShippingRules = { units: 'in/lb', padding: 2, divisor: 139, matBoardWeight: 0.2, mountingBoardWeight: 0.25, boxWeight: 0.11 };

const shadowbox: FrameForShipping = {
  outerWidthIn: 20,
  outerHeightIn: 16,
  matCount: 2,
  mouldingFaceWidthIn: 1.5,
  mouldingRabbetDepthIn: 2.5,
  mouldingWeightLbPerFoot: 0.9,
  shadowboxDepthIn: 2,
};

describe('glazing weight per area', () => {
  it('float glass 2.5 mm at 2500 kg/m3 (EN 572-1) weighs 6.25 kg/m2', () => {
    expect(glazingKgPerSquareMetre(floatGlass)).toBeCloseTo(6.25, 10);
  });

  it('acrylic 0.118 in at specific gravity 1.19 (ASTM D792) weighs about 3.57 kg/m2', () => {
    // 0.118 in = 2.9972 mm; 2.9972 mm x 1190 kg/m3 = 3.5667 kg/m2.
    expect(glazingKgPerSquareMetre(acrylic)).toBeCloseTo(3.57, 2);
    expect(glazingKgPerSquareMetre(acrylic)).toBeCloseTo(0.118 * MM * 1.19, 10);
  });
});

describe('dimensional and billed weight', () => {
  it("a 24 x 20 x 4 in box bills 14 lb at divisor 139 (UPS and FedEx published billable-weight rule: 1920 / 139 = 13.8)", () => {
    const dim = dimensionalWeight({ length: 24, width: 20, depth: 4 }, 139);
    expect(dim).toBeCloseTo(1920 / 139, 10);
    expect(dim).toBeCloseTo(13.8, 1);
    expect(billedWeight(9.2, dim)).toBe(14);
  });

  it('rounds each side up to the whole inch before multiplying (carriers measure to the next inch)', () => {
    // 23.1 x 19.01 x 3.2 measures as 24 x 20 x 4: the same 1920 cubic inches.
    expect(dimensionalWeight({ length: 23.1, width: 19.01, depth: 3.2 }, 139)).toBeCloseTo(1920 / 139, 10);
    // A heavier box bills its own weight, rounded up to the pound.
    expect(billedWeight(16.01, 1920 / 139)).toBe(17);
  });

  it('metric: 60 x 50 x 10 cm at divisor 5000 (FedEx and DHL international rules) is 6 kg, and 59.2 x 49.3 x 9.1 cm measures the same', () => {
    expect(dimensionalWeight({ length: 60, width: 50, depth: 10 }, 5000)).toBe(6);
    expect(dimensionalWeight({ length: 59.2, width: 49.3, depth: 9.1 }, 5000)).toBe(6);
    expect(billedWeight(4.3, 6)).toBe(6);
    expect(billedWeight(6.2, 6)).toBe(7);
  });

  it('refuses a divisor that is not positive', () => {
    expect(() => dimensionalWeight({ length: 1, width: 1, depth: 1 }, 0)).toThrow(/positive divisor/);
  });
});

describe('shipping estimate of a framed shadowbox', () => {
  it('a flat frame padded 1.5 in reproduces the 24 x 20 x 4 in box billing 14 lb', () => {
    const flat: FrameForShipping = { outerWidthIn: 18, outerHeightIn: 14, matCount: 1, mouldingFaceWidthIn: 1.5, mouldingRabbetDepthIn: 1, mouldingWeightLbPerFoot: 0.3, shadowboxDepthIn: 0 };
    const est = shippingEstimate(flat, acrylic, { ...inchRules, padding: 1.5 });
    expect(est.boxRounded).toEqual({ length: 24, width: 20, depth: 4 });
    expect(est.dimensional).toBeCloseTo(13.81, 2);
    expect(est.weights.packed).toBeLessThan(est.dimensional);
    expect(est.billed).toBe(14);
  });

  it('adds up glazing, mats, mounting board, moulding and box exactly as computed by hand', () => {
    const est = shippingEstimate(shadowbox, floatGlass, inchRules);
    // By hand: frame 20 + 2 x 1.5 = 23 by 19, depth the deeper of rabbet 2.5 and shadowbox 2.
    expect(est.frame).toEqual({ width: 23, height: 19, depth: 2.5 });
    expect(est.box).toEqual({ length: 27, width: 23, depth: 6.5 });
    expect(est.boxRounded).toEqual({ length: 27, width: 23, depth: 7 });
    const areaM2 = (20 * MM / 1000) * (16 * MM / 1000);
    const glassLb = (6.25 * areaM2) / LB; // 6.25 kg/m2 from EN 572-1's 2500 kg/m3
    const matsLb = 0.2 * (320 / 144) * 2;
    const mountingLb = 0.25 * (320 / 144);
    const mouldingLb = ((2 * (20 + 16) + 4 * 1.5) / 12) * 0.9; // mitred centre line: 78 in
    const boxLb = 0.11 * (2 * (27 * 23 + 27 * 6.5 + 23 * 6.5)) / 144;
    expect(est.weights.glazing).toBeCloseTo(glassLb, 2);
    expect(est.weights.mats).toBeCloseTo(matsLb, 2);
    expect(est.weights.mounting).toBeCloseTo(mountingLb, 2);
    expect(est.weights.moulding).toBeCloseTo(mouldingLb, 2);
    expect(est.weights.box).toBeCloseTo(boxLb, 2);
    const packed = glassLb + matsLb + mountingLb + mouldingLb + boxLb;
    expect(est.weights.packed).toBeCloseTo(packed, 2);
    expect(est.hanging).toBeCloseTo(packed - boxLb, 2);
    expect(est.dimensional).toBeCloseTo((27 * 23 * 7) / 139, 2);
    expect(est.billed).toBe(Math.ceil(Math.max(packed, (27 * 23 * 7) / 139)));
  });

  it('acrylic makes the same frame lighter than glass by the difference of the two sheets', () => {
    const glass = shippingEstimate(shadowbox, floatGlass, inchRules);
    const plastic = shippingEstimate(shadowbox, acrylic, inchRules);
    const areaM2 = (20 * MM / 1000) * (16 * MM / 1000);
    expect(glass.weights.packed - plastic.weights.packed).toBeCloseTo(((6.25 - 0.118 * MM * 1.19) * areaM2) / LB, 1);
    expect(plastic.boxRounded).toEqual(glass.boxRounded);
  });

  it('gives the same frame in centimetres and kilograms when the rules are the same quantities converted', () => {
    const metricRules: ShippingRules = {
      units: 'cm/kg',
      padding: 2 * 2.54,
      divisor: 5000,
      matBoardWeight: (0.2 * LB) / SQ_FT_M2,
      mountingBoardWeight: (0.25 * LB) / SQ_FT_M2,
      boxWeight: (0.11 * LB) / SQ_FT_M2,
    };
    const inch = shippingEstimate(shadowbox, floatGlass, inchRules);
    const metric = shippingEstimate(shadowbox, floatGlass, metricRules);
    expect(metric.box.length).toBeCloseTo(inch.box.length * 2.54, 1);
    expect(metric.box.depth).toBeCloseTo(6.5 * 2.54, 1);
    expect(metric.boxRounded).toEqual({ length: 69, width: 59, depth: 17 });
    expect(metric.weights.packed).toBeCloseTo(inch.weights.packed * KILOGRAMS_PER_POUND, 1);
    expect(metric.dimensional).toBeCloseTo((69 * 59 * 17) / 5000, 2);
  });

  it('puts the longer side first whichever way the frame stands', () => {
    const portrait = shippingEstimate({ ...shadowbox, outerWidthIn: 16, outerHeightIn: 20 }, acrylic, inchRules);
    expect(portrait.boxRounded).toEqual({ length: 27, width: 23, depth: 7 });
  });

  it('moulding centre line is the perimeter plus four face widths (mitred corners; supplier examples add 8 for offcuts)', () => {
    expect(mouldingCentreLineIn({ outerWidthIn: 8, outerHeightIn: 10, mouldingFaceWidthIn: 1 })).toBe(36 + 4);
  });
});
