import { and, asc, desc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { jobs, layouts, layoutVersions, members, pieces, proofs, shipments } from '../../db/schema';
import { defaultGlazing, glazingKindLabels, isGlass, type GlazingKind, type GlazingMaterial } from '../../features/settings/materials';
import type { ShopSettings } from '../../features/settings/schema';
import type { JobShipping, Shipment, ShippingEstimateView } from '../../features/shipping/schema';
import { parseLayout, shippingEstimate, type FrameForShipping, type Layout } from '../../geometry';
import { notFound } from '../errors';
import { getShopSettings } from './settings';
import { joinDraft } from './draftOutlines';

const MAX_PACKED_PIECES = 200;

/** The glass and the acrylic of the same family (UV-filtering or not), glass first, for showing side by side. */
export function glazingPair(chosen: GlazingKind): [GlazingKind, GlazingKind] {
  const uv = chosen === 'uv_glass' || chosen === 'uv_acrylic';
  return uv ? ['uv_glass', 'uv_acrylic'] : ['regular_glass', 'acrylic'];
}

function glazingOf(settings: ShopSettings, kind: GlazingKind): GlazingMaterial {
  return settings.glazing.find((g) => g.kind === kind) ?? defaultGlazing.find((g) => g.kind === kind)!;
}

/**
 * The document the frame is built around: the version on the job's latest approved proof,
 * otherwise the most recently edited layout's draft.
 */
async function documentToShip(db: Db, shopId: string, jobId: string): Promise<Layout | null> {
  const [approved] = await db
    .select({ document: layoutVersions.document })
    .from(proofs)
    .innerJoin(layoutVersions, and(eq(layoutVersions.layoutId, proofs.layoutId), eq(layoutVersions.number, proofs.versionNumber)))
    .where(and(eq(proofs.shopId, shopId), eq(proofs.jobId, jobId), eq(proofs.state, 'approved')))
    .orderBy(desc(proofs.decidedAt))
    .limit(1);
  const [draft] = approved ? [] : await db.select({ document: layouts.draft, lists: layouts.draftOutlines }).from(layouts).where(and(eq(layouts.shopId, shopId), eq(layouts.jobId, jobId))).orderBy(desc(layouts.updatedAt)).limit(1);
  const document = approved?.document ?? (draft ? joinDraft(draft.document, draft.lists) : undefined);
  if (document === undefined) return null;
  const parsed = parseLayout(document);
  return parsed.ok ? parsed.layout : null;
}

export async function shipmentOf(db: Db, shopId: string, jobId: string): Promise<Shipment | null> {
  const [row] = await db
    .select({ s: shipments, name: members.name })
    .from(shipments)
    .leftJoin(members, eq(members.id, shipments.shippedBy))
    .where(and(eq(shipments.shopId, shopId), eq(shipments.jobId, jobId)));
  if (!row) return null;
  return { carrier: row.s.carrier, trackingNumber: row.s.trackingNumber, trackingUrl: row.s.trackingUrl, shippedAt: row.s.shippedAt.toISOString(), shippedByName: row.name };
}

type Estimates = Pick<JobShipping, 'estimates' | 'missing' | 'chosenGlazing'> & { frame: FrameForShipping | null; mouldingName: string | null };

/** Glass and acrylic estimates for the job's frame, or the reason there are none yet. */
export function estimatesFor(settings: ShopSettings, frameChoice: typeof jobs.$inferSelect['frame'], layout: Layout | null): Estimates {
  const none = (missing: string): Estimates => ({ estimates: [], missing, chosenGlazing: frameChoice?.glazingKind ?? null, frame: null, mouldingName: null });
  if (!layout) return none('Design a layout for this job first: the box is sized from its outer edge.');
  if (!frameChoice) return none('Choose the moulding and glazing for this job first.');
  const moulding = settings.mouldings.find((m) => m.code === frameChoice.mouldingCode);
  if (!moulding) return none(`The moulding ${frameChoice.mouldingCode} is no longer in the shop's list; choose another.`);
  const frame: FrameForShipping = {
    outerWidthIn: layout.outer.width,
    outerHeightIn: layout.outer.height,
    matCount: layout.mats.length,
    mouldingFaceWidthIn: moulding.faceWidthIn,
    mouldingRabbetDepthIn: moulding.rabbetDepthIn,
    mouldingWeightLbPerFoot: moulding.weightLbPerFoot,
    shadowboxDepthIn: frameChoice.shadowboxDepthIn,
  };
  const estimates: ShippingEstimateView[] = glazingPair(frameChoice.glazingKind).map((kind) => ({
    glazingKind: kind,
    glazingLabel: glazingKindLabels[kind],
    isGlass: isGlass(kind),
    ...shippingEstimate(frame, glazingOf(settings, kind), settings.shipping),
  }));
  return { estimates, missing: null, chosenGlazing: frameChoice.glazingKind, frame, mouldingName: `${moulding.code} ${moulding.name}` };
}

/** Everything the job's shipping panel shows: the box and weights with glass and with acrylic, the packing list's facts, the shipment. */
export async function jobShipping(db: Db, shopId: string, jobId: string): Promise<JobShipping> {
  const [job] = await db.select({ frame: jobs.frame }).from(jobs).where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!job) throw notFound('Job');
  const settings = await getShopSettings(db, shopId);
  const layout = await documentToShip(db, shopId, jobId);
  const result = estimatesFor(settings, job.frame, layout);
  const pieceRows = await db.select({ label: pieces.label, kind: pieces.kind }).from(pieces).where(eq(pieces.jobId, jobId)).orderBy(asc(pieces.createdAt)).limit(MAX_PACKED_PIECES);
  return {
    units: settings.shipping.units,
    divisor: settings.shipping.divisor,
    padding: settings.shipping.padding,
    chosenGlazing: result.chosenGlazing,
    estimates: result.estimates,
    missing: result.missing,
    packing: layout
      ? { matCount: layout.mats.length, pieces: pieceRows, outerWidthIn: layout.outer.width, outerHeightIn: layout.outer.height, mouldingName: result.mouldingName }
      : null,
    carriers: settings.shipping.carriers,
    shipment: await shipmentOf(db, shopId, jobId),
  };
}
