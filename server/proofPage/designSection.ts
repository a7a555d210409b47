import type { Layout } from '../../geometry/layoutSchema';
import { formatLength } from '../../geometry/units';
import type { PublicProofView } from '../../features/proofs/schema';
import { centsText, moneyText, type PublicQuoteView } from '../../features/quotes/schema';
import { colourWords } from '../../features/ui/colourWords';
import { html, type SafeHtml } from './html';
import { proofPictureSvg } from './pictureSvg';

const inches = (value: number) => formatLength(value, '1/16');

/** The picture in its zoom frame; the zoom buttons' row below it is kept empty until the zoom script runs, so nothing moves and nothing covers the design. */
function zoomablePicture(layout: Layout, drawing: NonNullable<PublicProofView['drawing']>, pieces: PublicProofView['pieces']): SafeHtml {
  const label = `Picture of the proposed mats, ${inches(layout.outer.width)} wide by ${inches(layout.outer.height)} high: ${layout.mats.map((m) => colourWords(m.color)).join(' over ')}${pieces.some((p) => p.photo) ? ', with your pieces in their openings' : ''}`;
  return html`<div class="zoom-area"><div class="zoom-frame" data-zoom-frame tabindex="0" aria-label="The design; press plus or minus to zoom" data-testid="proof-zoom-frame"><div class="zoom-content" data-testid="proof-zoom-content">${proofPictureSvg(layout, drawing, pieces, label)}</div></div>
<div class="zoom-tools" data-zoom-tools hidden><button type="button" class="secondary" data-zoom="out" aria-label="Zoom out" data-testid="proof-zoom-out">−</button><button type="button" class="secondary" data-zoom="fit" data-testid="proof-zoom-fit">Whole design</button><button type="button" class="secondary" data-zoom="in" aria-label="Zoom in" data-testid="proof-zoom-in">+</button></div></div>`;
}

/** The frozen design as the cut files will make it, with its outer size, mats and pieces in plain words. */
/** The frame in plain words, with the glass caution where the glazing is glass. */
function frameWords(frame: PublicProofView['frame']): SafeHtml {
  if (!frame) return html`<p data-testid="proof-frame">No frame has been chosen for this design yet; ask the shop if you would like to see one.</p>`;
  const depth = frame.shadowboxDepthIn > 0 ? html`, ${inches(frame.shadowboxDepthIn)} deep inside for your piece` : html``;
  return html`<p data-testid="proof-frame">Frame: ${frame.moulding}, ${inches(frame.faceWidthIn)} wide at the front${depth}, glazed with ${frame.glazing.toLowerCase()}. Outside size with the frame: about ${inches(frame.outerWidthIn)} wide by ${inches(frame.outerHeightIn)} high.</p>${
    frame.isGlass ? html`<p class="caption">Glass can break: handle the framed piece with care and hang it on two hangers rated for its weight, fixed into studs or wall anchors as local codes require.</p>` : html``
  }`;
}

export function designSection(layout: Layout, drawing: PublicProofView['drawing'], pieces: PublicProofView['pieces'], frame: PublicProofView['frame'] = null): SafeHtml {
  const openings = layout.openings.length === 1 ? 'One opening is cut in the mats.' : `${layout.openings.length} openings are cut in the mats.`;
  return html`${drawing ? zoomablePicture(layout, drawing, pieces) : html`<p>The picture of this design could not be drawn; the sizes and colours below are as frozen.</p>`}
<p data-testid="proof-outer">Finished size of the mats: ${inches(layout.outer.width)} wide by ${inches(layout.outer.height)} high.</p>
${frameWords(frame)}
<h2>Mats, from the top</h2>
<ul class="mats">${layout.mats.map(
    (mat, i) =>
      html`<li><svg class="swatch-svg" width="28" height="28" viewBox="0 0 28 28" aria-hidden="true"><rect x="2" y="2" width="24" height="24" rx="5" fill="${mat.color}" stroke="${mat.coreColor}" stroke-width="4"/></svg><span>${i + 1}. ${mat.name} (${colourWords(mat.color)}), with a ${colourWords(mat.coreColor)} core showing at the bevel</span></li>`,
  )}</ul>
<h2>Your pieces</h2>
${pieces.length === 0 ? html`<p class="caption">No pieces are listed on this job.</p>` : html`<ul class="pieces">${pieces.map((p) => html`<li data-testid="proof-piece">${p.label}: ${inches(p.widthIn)} by ${inches(p.heightIn)}</li>`)}</ul>`}
<h2>Openings</h2>
<p>${openings}</p>`;
}

/** The price that came with the design, line by line; approving the design accepts it. */
export function quoteSection(quote: PublicQuoteView): SafeHtml {
  const sum = (label: string, amount: string, testId?: string, strong = false) =>
    html`<div class="row${strong ? ' total' : ''}"><span>${label}</span><span class="amount"${testId ? html` data-testid="${testId}"` : ''}>${amount}</span></div>`;
  return html`<section class="quote" data-testid="proof-quote" aria-labelledby="price-heading"><h2 id="price-heading">Price</h2>
${quote.lines.map((line) => html`<div class="quote-line" data-testid="quote-line"><div class="row"><span>${line.label}</span><span class="amount">${centsText(line.amountCents)}</span></div><p class="caption">${line.explanation}</p></div>`)}
${sum('Subtotal', centsText(quote.subtotalCents))}${sum(`Tax, ${quote.taxRatePercent} %`, centsText(quote.taxCents))}${sum('Total', moneyText(quote.totalCents, quote.currency), 'quote-total', true)}${sum(`Deposit, ${quote.depositSharePercent} % of the total`, moneyText(quote.depositCents, quote.currency), 'quote-deposit')}
<p class="caption">${quote.state === 'accepted' ? 'You accepted this price when you approved the design.' : 'Approving the design also accepts this price. Asking for changes does not.'}</p></section>`;
}
