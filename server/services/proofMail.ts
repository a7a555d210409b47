import { and, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { customers, jobs, shops } from '../../db/schema';
import { HttpError } from '../errors';
import { escapeHtml } from '../mail/escapeHtml';
import type { InlineImage, Mailer } from '../mail/mailer';
import { PROOF_PICTURE_CID } from './proofPicture';

/** The customer's address for a job's proof, or a 400 naming the field when there is none. */
export async function proofRecipient(db: Db, shopId: string, jobId: string) {
  const [row] = await db
    .select({ email: customers.email, customerName: customers.name, title: jobs.title, shopName: shops.name })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(shops, eq(shops.id, jobs.shopId))
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!row?.email) {
    throw new HttpError(400, 'invalid_input', 'The customer has no e-mail address', {
      emailCustomer: 'The customer has no e-mail address; add one to the customer or copy the link instead',
    });
  }
  return { ...row, email: row.email };
}

interface ProofMailFacts {
  shopId: string;
  to: string;
  customerName: string;
  shopName: string;
  title: string;
  message: string | null;
  link: string;
  expiresAt: string;
  /** The design as a PNG, carried inline; without it the message has words only. */
  picture: Buffer | null;
}

/** The proof's e-mail in plain text and HTML with the same words; its one picture travels inside it, nothing is fetched, nothing tracks. */
export function proofMail(f: ProofMailFacts) {
  const until = new Date(f.expiresAt).toDateString();
  const subject = `${f.shopName}: your design for ${f.title} is ready to approve`;
  const lines = [
    `Hello ${f.customerName},`,
    '',
    `${f.shopName} has a design ready for ${f.title}.`,
    ...(f.message ? ['', f.message] : []),
    '',
    ...(f.picture ? ['A picture of the proposed mats is attached.', ''] : []),
    'See it, approve it or ask for changes here:',
    f.link,
    '',
    `The link stays open until ${until}. Do not pass it on: anyone with it can answer for you.`,
  ];
  const html = [
    `<p>Hello ${escapeHtml(f.customerName)},</p>`,
    `<p>${escapeHtml(f.shopName)} has a design ready for ${escapeHtml(f.title)}.</p>`,
    ...(f.message ? [`<p>${escapeHtml(f.message).replace(/\n/g, '<br>')}</p>`] : []),
    ...(f.picture
      ? [`<p><img src="cid:${PROOF_PICTURE_CID}" alt="${escapeHtml(`The proposed mats for ${f.title}`)}" style="max-width:100%;height:auto;border:1px solid #ccc"></p>`]
      : []),
    `<p><a href="${escapeHtml(f.link)}">See the design, approve it or ask for changes</a></p>`,
    `<p>The link stays open until ${escapeHtml(until)}. Do not pass it on: anyone with it can answer for you.</p>`,
  ].join('\n');
  const inlineImages: InlineImage[] = f.picture ? [{ cid: PROOF_PICTURE_CID, filename: 'design.png', contentType: 'image/png', content: f.picture }] : [];
  return { shopId: f.shopId, to: f.to, subject, text: lines.join('\n'), html, purpose: 'proof', inlineImages };
}

/** Sends the proof's e-mail; a failure is returned in words (the proof and its link stand), never thrown. */
export async function mailProof(mailer: Mailer, facts: ProofMailFacts): Promise<string | null> {
  try {
    await mailer.send(proofMail(facts));
    return null;
  } catch (err) {
    return err instanceof Error ? err.message : 'The e-mail could not be sent';
  }
}
