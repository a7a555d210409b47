import { and, desc, eq } from 'drizzle-orm';
import type { z } from 'zod';
import type { Db } from '../../db/client';
import { jobs, proofs, shipments } from '../../db/schema';
import { isGlass } from '../../features/settings/materials';
import { trackingLink, type shipmentInput } from '../../features/shipping/schema';
import type { Mailer } from '../mail/mailer';
import { HttpError, notFound } from '../errors';
import { changeJobStatus } from './jobs';
import { proofRecipient } from './proofMail';
import { hashProofToken, newProofToken } from './proofs';
import { getShopSettings } from './settings';
import { jobShipping, shipmentOf } from './shipping';
import { mailShippedNotice } from './shippedNotice';
import type { MemberRole } from '../../features/auth/schema';

type ShipmentValues = z.output<typeof shipmentInput>;

/** The job's latest approved proof: its page becomes the arrival page. */
async function approvedProofId(db: Db, shopId: string, jobId: string): Promise<string | null> {
  const [row] = await db
    .select({ id: proofs.id })
    .from(proofs)
    .where(and(eq(proofs.shopId, shopId), eq(proofs.jobId, jobId), eq(proofs.state, 'approved')))
    .orderBy(desc(proofs.decidedAt))
    .limit(1);
  return row?.id ?? null;
}

/**
 * Records the carrier and tracking number, moves the job to shipped (through the
 * job's own status rules) and e-mails the customer once. A refused move removes the
 * shipment again, so nothing is half recorded. Returns the arrival link's secret once.
 */
/** Who marks the job shipped: the status rules depend on their role. */
type Shipper = { id: string; role: MemberRole };

async function recordShipment(db: Db, shopId: string, member: Shipper, jobId: string, values: ShipmentValues, trackingUrl: string) {
  const proofId = await approvedProofId(db, shopId, jobId);
  const token = proofId ? newProofToken() : null;
  const inserted = await db
    .insert(shipments)
    .values({ shopId, jobId, carrier: values.carrier, trackingNumber: values.trackingNumber, trackingUrl, proofId, arrivalTokenHash: token ? hashProofToken(token) : null, shippedBy: member.id })
    .onConflictDoNothing({ target: shipments.jobId })
    .returning({ id: shipments.id });
  if (inserted.length === 0) throw new HttpError(409, 'already_shipped', 'This job is already marked shipped; its tracking number is on the job');
  const [job] = await db.select({ status: jobs.status }).from(jobs).where(eq(jobs.id, jobId));
  if (job?.status !== 'shipped') {
    try {
      await changeJobStatus(db, shopId, member, jobId, { status: 'shipped', note: `${values.carrier} ${values.trackingNumber}` });
    } catch (err) {
      await db.delete(shipments).where(eq(shipments.id, inserted[0]!.id));
      throw err;
    }
  }
  return token;
}

export async function markShipped(db: Db, mailer: Mailer, publicUrl: string, shopId: string, member: Shipper, jobId: string, values: ShipmentValues) {
  const [job] = await db.select({ frame: jobs.frame }).from(jobs).where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!job) throw notFound('Job');
  const settings = await getShopSettings(db, shopId);
  const carrier = settings.shipping.carriers.find((c) => c.name.toLowerCase() === values.carrier.toLowerCase());
  if (!carrier) throw new HttpError(400, 'invalid_input', 'Choose one of the shop\'s carriers', { carrier: 'Not one of the carriers in the shop settings' });
  // The address is checked before anything is recorded.
  const recipient = values.emailCustomer ? await proofRecipient(db, shopId, jobId) : null;
  const trackingUrl = trackingLink(carrier.trackingUrl, values.trackingNumber);
  const token = await recordShipment(db, shopId, member, jobId, { ...values, carrier: carrier.name }, trackingUrl);
  let mailError: string | null = null;
  if (recipient) {
    const view = await jobShipping(db, shopId, jobId);
    const chosen = view.estimates.find((e) => e.glazingKind === view.chosenGlazing) ?? null;
    const unit = settings.shipping.units === 'in/lb' ? 'lb' : 'kg';
    mailError = await mailShippedNotice(mailer, {
      shopId,
      to: recipient.email,
      customerName: recipient.customerName,
      shopName: recipient.shopName,
      title: recipient.title,
      carrier: carrier.name,
      trackingNumber: values.trackingNumber,
      trackingUrl,
      arrivalLink: token ? `${publicUrl.replace(/\/$/, '')}/proof/${token}` : null,
      acrylic: job.frame ? !isGlass(job.frame.glazingKind) : false,
      hangingWeight: chosen ? `${chosen.hanging.toFixed(1)} ${unit}` : null,
      anchorRating: chosen ? `${(2 * chosen.hanging).toFixed(1)} ${unit}` : null,
    });
  }
  const shipment = (await shipmentOf(db, shopId, jobId))!;
  return { shipment, emailedTo: recipient && !mailError ? recipient.email : null, mailError };
}
