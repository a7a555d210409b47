import { z } from 'zod';
import { optionalTextField, textField } from '../text/schema';

export const shippingUnits = ['in/lb', 'cm/kg'] as const;
export type ShippingUnitsName = (typeof shippingUnits)[number];
export const MAX_CARRIERS = 20;
export const TRACKING_PLACEHOLDER = '{tracking}';

/** A carrier the shop ships with; its tracking page address has {tracking} where the number goes. */
export const carrier = z.object({
  name: textField({ max: 60, required: 'Name the carrier' }),
  trackingUrl: textField({ max: 300, required: 'Give the tracking page address' })
    .refine((v) => /^https?:\/\/[^\s]+$/i.test(v), 'Start the address with https:// (or http://)')
    .refine((v) => v.includes(TRACKING_PLACEHOLDER), `Put ${TRACKING_PLACEHOLDER} where the tracking number goes`),
});
export type Carrier = z.infer<typeof carrier>;

const positive = (label: string, max: number) =>
  z.number({ error: `${label} must be a number` }).min(0, `${label} cannot be negative`).max(max, `${label} must be at most ${max}`);

/** How the shop packs and ships; every value is in the chosen units (in and lb per sq ft, or cm and kg per m2). */
export const shippingSettings = z
  .object({
    units: z.enum(shippingUnits),
    /** Padding on each side of the frame inside the box. */
    padding: positive('Padding', 30),
    /** Carriers' dimensional divisor: 139 for inches and pounds, 5000 for centimetres and kilograms (published rules; they change). */
    divisor: z.number({ error: 'The divisor must be a number' }).min(1, 'The divisor must be at least 1').max(20_000, 'The divisor must be at most 20000'),
    /** One mat board's weight per area. */
    matBoardWeight: positive('Mat board weight', 10),
    mountingBoardWeight: positive('Mounting board weight', 10),
    /** The carton's weight per area of its surface. */
    boxWeight: positive('Box weight', 10),
    carriers: z.array(carrier).max(MAX_CARRIERS, `At most ${MAX_CARRIERS} carriers`),
  })
  .refine((s) => new Set(s.carriers.map((c) => c.name.toLowerCase())).size === s.carriers.length, { message: 'Two carriers have the same name', path: ['carriers'] });
export type ShippingSettings = z.infer<typeof shippingSettings>;

/**
 * Starting values. Divisors: UPS and FedEx published billable-weight rules (139), FedEx and DHL
 * international (5000). Board and carton weights are from memory (4-ply board about 0.2 lb/sq ft,
 * single-wall corrugated about 0.11 lb/sq ft): weigh your own stock. Carriers are invented examples.
 */
export const defaultShippingSettings: ShippingSettings = {
  units: 'in/lb',
  padding: 2,
  divisor: 139,
  matBoardWeight: 0.2,
  mountingBoardWeight: 0.2,
  boxWeight: 0.11,
  carriers: [
    { name: 'Parcel carrier', trackingUrl: 'https://parcels.example/track?number={tracking}' },
    { name: 'Freight courier', trackingUrl: 'https://freight.example/t/{tracking}' },
  ],
};

/** The same defaults for a shop that works in centimetres and kilograms (1 in = 2.54 cm; 1 lb/sq ft = 4.882 kg/m2). */
export const metricShippingDefaults: Omit<ShippingSettings, 'units' | 'carriers'> = {
  padding: 5,
  divisor: 5000,
  matBoardWeight: 1,
  mountingBoardWeight: 1,
  boxWeight: 0.55,
};

/** The tracking page for a number; the number is URL-encoded so it cannot change the address. */
export const trackingLink = (pattern: string, tracking: string) => pattern.split(TRACKING_PLACEHOLDER).join(encodeURIComponent(tracking));

/** Marking a job shipped. */
export const shipmentInput = z.object({
  carrier: textField({ max: 60, required: 'Choose a carrier' }),
  trackingNumber: textField({ max: 60, required: 'Type the tracking number' }).refine((v) => /^[A-Za-z0-9 -]+$/.test(v), 'Letters, digits, spaces and dashes only'),
  /** Also e-mail the customer the tracking and arrival links (needs their address). */
  emailCustomer: z.boolean().default(true),
});
export type ShipmentInput = z.input<typeof shipmentInput>;

export const shipment = z.object({
  carrier: z.string(),
  trackingNumber: z.string(),
  trackingUrl: z.string(),
  shippedAt: z.string(),
  shippedByName: z.string().nullable(),
});
export type Shipment = z.infer<typeof shipment>;

const sides = z.object({ length: z.number(), width: z.number(), depth: z.number() });
export const shippingEstimateView = z.object({
  glazingKind: z.string(),
  glazingLabel: z.string(),
  isGlass: z.boolean(),
  frame: z.object({ width: z.number(), height: z.number(), depth: z.number() }),
  box: sides,
  boxRounded: sides,
  weights: z.object({ glazing: z.number(), mats: z.number(), mounting: z.number(), moulding: z.number(), box: z.number(), packed: z.number() }),
  dimensional: z.number(),
  billed: z.number(),
  hanging: z.number(),
});
export type ShippingEstimateView = z.infer<typeof shippingEstimateView>;

/** What the job's shipping panel reads. `missing` says in words why there is no estimate yet. */
export const jobShipping = z.object({
  units: z.enum(shippingUnits),
  divisor: z.number(),
  padding: z.number(),
  chosenGlazing: z.string().nullable(),
  estimates: z.array(shippingEstimateView),
  missing: z.string().nullable(),
  packing: z.object({ matCount: z.number(), pieces: z.array(z.object({ label: z.string(), kind: z.string() })), outerWidthIn: z.number(), outerHeightIn: z.number(), mouldingName: z.string().nullable() }).nullable(),
  carriers: z.array(carrier),
  shipment: shipment.nullable(),
});
export type JobShipping = z.infer<typeof jobShipping>;

export const shipmentResult = z.object({ shipment, emailedTo: z.string().nullable(), mailError: z.string().nullable() });

/** The customer's note on how the frame arrived. */
export const arrivalCommentInput = z.object({ comment: optionalTextField({ max: 2000, multiline: true }) });
export const MAX_ARRIVAL_PHOTOS = 3;

/** What the shop sees of the customer's arrival note. */
export const arrivalReport = z.object({
  comment: z.string().nullable(),
  commentedAt: z.string().nullable(),
  photos: z.array(z.object({ id: z.string(), url: z.string(), showcase: z.boolean(), createdAt: z.string() })),
});
export type ArrivalReport = z.infer<typeof arrivalReport>;
