import { escapeHtml } from '../mail/escapeHtml';
import type { Mailer } from '../mail/mailer';

export interface ShippedFacts {
  shopId: string;
  to: string;
  customerName: string;
  shopName: string;
  title: string;
  carrier: string;
  trackingNumber: string;
  trackingUrl: string;
  /** The page where the customer tells the shop how it arrived; null when the job has no approved proof. */
  arrivalLink: string | null;
  /** Acrylic glazing: the care line about cleaners applies. */
  acrylic: boolean;
  /** What hangs on the wall, in the shop's weight unit, e.g. "9.4 lb"; null when unknown. */
  hangingWeight: string | null;
  /** Twice the hanging weight, in the same unit. */
  anchorRating: string | null;
}

function careLines(f: ShippedFacts): string[] {
  return [
    'Open the box flat on the floor, this side up, and lift the frame out by its sides.',
    ...(f.acrylic ? ['The glazing is acrylic: clean it with a soft cloth and an acrylic cleaner or mild soapy water, never a glass cleaner.'] : []),
    f.hangingWeight
      ? `The frame weighs about ${f.hangingWeight}. Hang it from two hangers screwed into studs, or into wall anchors rated for at least ${f.anchorRating} together (twice its weight), following local building codes; ask a licensed installer if you are unsure of your wall.`
      : 'Hang it from two hangers screwed into studs, or into wall anchors rated for at least twice its weight, following local building codes.',
  ];
}

/** The shipped notice in plain text and HTML with the same words; no images, no tracking pixels. */
export function shippedNotice(f: ShippedFacts) {
  const subject = `${f.shopName}: ${f.title} is on its way`;
  const text = [
    `Hello ${f.customerName},`,
    '',
    `${f.shopName} has shipped ${f.title} with ${f.carrier}, tracking number ${f.trackingNumber}.`,
    '',
    'Follow it here:',
    f.trackingUrl,
    ...(f.arrivalLink ? ['', 'When it arrives, tell us how it came through, with a photo or two if you like:', f.arrivalLink] : []),
    '',
    ...careLines(f),
  ].join('\n');
  const html = [
    `<p>Hello ${escapeHtml(f.customerName)},</p>`,
    `<p>${escapeHtml(f.shopName)} has shipped ${escapeHtml(f.title)} with ${escapeHtml(f.carrier)}, tracking number ${escapeHtml(f.trackingNumber)}.</p>`,
    `<p><a href="${escapeHtml(f.trackingUrl)}">Follow the parcel</a></p>`,
    ...(f.arrivalLink ? [`<p><a href="${escapeHtml(f.arrivalLink)}">When it arrives, tell us how it came through</a></p>`] : []),
    ...careLines(f).map((line) => `<p>${escapeHtml(line)}</p>`),
  ].join('\n');
  return { shopId: f.shopId, to: f.to, subject, text, html, purpose: 'shipped' };
}

/** Sends the notice; a failure comes back in words (the shipment stands), never thrown. */
export async function mailShippedNotice(mailer: Mailer, facts: ShippedFacts): Promise<string | null> {
  try {
    await mailer.send(shippedNotice(facts));
    return null;
  } catch (err) {
    return err instanceof Error ? err.message : 'The e-mail could not be sent';
  }
}
