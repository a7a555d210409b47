import { eq } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import { customers, jobs } from '../../db/schema';
import { escapeHtml } from '../mail/escapeHtml';
import type { Mailer, OutgoingMail } from '../mail/mailer';
import { shopContact } from './proofs';

/** What the customer decided on one proof, as the shop's message needs it. */
export interface ProofDecided {
  shopId: string;
  jobId: string;
  versionNumber: number;
  decision: 'approved' | 'changes_asked';
  /** The typed name for an approval, the comment for a change request. */
  words: string;
  /** The customer sent a photo of their own sketch or note with the change request. */
  withPhoto: boolean;
}

interface DecisionMailFacts extends ProofDecided {
  to: string;
  shopName: string;
  jobTitle: string;
  customerName: string | null;
  jobLink: string;
}

/** The shop's notice of a decision, plain text and HTML with the same words; the comment is quoted as typed. */
export function proofDecisionMail(f: DecisionMailFacts): OutgoingMail {
  const who = f.customerName ?? 'The customer';
  const approved = f.decision === 'approved';
  const subject = approved ? `Approved: ${f.jobTitle}` : `Changes asked: ${f.jobTitle}`;
  const headline = approved
    ? `${who} approved version ${f.versionNumber} of the design for ${f.jobTitle}, signing as "${f.words}".`
    : `${who} asked for changes to version ${f.versionNumber} of the design for ${f.jobTitle}.`;
  const photoNote = f.withPhoto ? 'They attached a photo of a sketch or note; it is on the job.' : null;
  const text = [
    headline,
    ...(approved ? [] : ['', 'They wrote:', f.words]),
    ...(photoNote ? ['', photoNote] : []),
    '',
    'Open the job:',
    f.jobLink,
  ].join('\n');
  const html = [
    `<p>${escapeHtml(headline)}</p>`,
    ...(approved ? [] : [`<p>They wrote:</p>`, `<blockquote>${escapeHtml(f.words).replace(/\n/g, '<br>')}</blockquote>`]),
    ...(photoNote ? [`<p>${escapeHtml(photoNote)}</p>`] : []),
    `<p><a href="${escapeHtml(f.jobLink)}">Open the job</a></p>`,
  ].join('\n');
  return { shopId: f.shopId, to: f.to, subject, text, html, purpose: approved ? 'proof approved' : 'proof changes asked' };
}

/**
 * Tells the shop (today: its first owner's address) what the customer decided.
 * The decision already stands; a failed send is logged and kept in the outbox,
 * never shown to the customer as an error.
 */
export async function mailProofDecision(db: Db, mailer: Mailer, publicUrl: string, decided: ProofDecided, logger?: Logger): Promise<void> {
  try {
    const contact = await shopContact(db, decided.shopId);
    if (!contact.email) return;
    const [job] = await db
      .select({ title: jobs.title, customerName: customers.name })
      .from(jobs)
      .leftJoin(customers, eq(customers.id, jobs.customerId))
      .where(eq(jobs.id, decided.jobId));
    const jobLink = `${publicUrl.replace(/\/$/, '')}/jobs/${decided.jobId}`;
    await mailer.send(proofDecisionMail({ ...decided, to: contact.email, shopName: contact.name, jobTitle: job?.title ?? '', customerName: job?.customerName ?? null, jobLink }));
  } catch (err) {
    logger?.warn({ err }, 'The decision e-mail to the shop could not be sent');
  }
}
