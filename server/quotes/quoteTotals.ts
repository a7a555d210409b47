import { centsText, derivedLineKinds, type QuoteLine, type QuoteTerms } from '../../features/quotes/schema';
import { percentOf } from './layoutQuote';

const materialKinds = new Set<QuoteLine['kind']>(['mat', 'glazing', 'moulding', 'spacer']);
const derived = new Set<QuoteLine['kind']>(derivedLineKinds);

export interface QuoteSums {
  lines: QuoteLine[];
  subtotalCents: number;
  taxCents: number;
  totalCents: number;
  depositCents: number;
}

/** A mat's name may be long; the stored line keeps the schema's limits (label 200, explanation 400 characters). */
const withinLimits = (line: QuoteLine): QuoteLine => ({ ...line, label: line.label.slice(0, 200), explanation: line.explanation.slice(0, 400) });

const sum = (lines: readonly QuoteLine[]) => lines.reduce((total, line) => total + line.amountCents, 0);

/** Markup on materials, the minimum charge, tax and deposit, on top of the priced lines (any old derived lines are dropped first). */
export function quoteSums(pricedLines: readonly QuoteLine[], terms: QuoteTerms): QuoteSums {
  const lines = pricedLines.filter((line) => !derived.has(line.kind)).map(withinLimits);
  const materials = sum(lines.filter((line) => materialKinds.has(line.kind)));
  const markup = percentOf(materials, terms.markupPercent);
  if (markup > 0) {
    lines.push({
      kind: 'markup',
      label: `Markup on materials, ${terms.markupPercent} %`,
      explanation: `${terms.markupPercent} % of ${centsText(materials)} of materials`,
      amountCents: markup,
    });
  }
  const work = sum(lines);
  if (work < terms.minimumChargeCents) {
    lines.push({
      kind: 'minimum',
      label: 'Minimum charge',
      explanation: `The shop's minimum is ${centsText(terms.minimumChargeCents)}; the work comes to ${centsText(work)}, so ${centsText(terms.minimumChargeCents - work)} is added`,
      amountCents: terms.minimumChargeCents - work,
    });
  }
  const subtotalCents = sum(lines);
  const taxCents = percentOf(subtotalCents, terms.taxRatePercent);
  const totalCents = subtotalCents + taxCents;
  return { lines, subtotalCents, taxCents, totalCents, depositCents: percentOf(totalCents, terms.depositSharePercent) };
}
