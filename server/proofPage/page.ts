import { parseLayout } from '../../geometry/layout';
import { PROOF_CLOSED_ADVICE, PROOF_CLOSED_MESSAGE, type PublicProofView } from '../../features/proofs/schema';
import { decisionForms, decisionShown, dateText, type FormProblem } from './answerSection';
import { arrivalSection, type ArrivalDone } from './arrivalSection';
import type { ProofPageAssets } from './assets';
import { designSection, quoteSection } from './designSection';
import { html, type SafeHtml } from './html';

type Links = Pick<ProofPageAssets, 'css' | 'script' | 'font'>;

/** The whole document: no script but the zoom file, never indexed, phone-width viewport that still lets the customer pinch. */
function documentOf(assets: Links, title: string, body: SafeHtml, withZoom: boolean): string {
  return `<!doctype html>${html`<html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex, nofollow">
<meta name="referrer" content="no-referrer">
<title>${title}</title>
<link rel="preload" href="${assets.font}" as="font" type="font/woff2" crossorigin>
<link rel="stylesheet" href="${assets.css}">
${withZoom ? html`<script src="${assets.script}" defer></script>` : ''}
</head><body><main><p class="page-title">Your framing proof</p><div class="card">${body}</div></main></body></html>`.text}`;
}

/** What the open page carries besides the proof: a mistake to show beside its field, or a note of what just went through. */
export interface PageExtras {
  problem?: FormProblem;
  /** Words above everything, e.g. that the proof was already answered. */
  notice?: string;
  arrivalDone?: ArrivalDone;
}

function contact(proof: PublicProofView, decided: boolean): SafeHtml {
  const write = proof.shop.email ? `Questions? Write to ${proof.shop.name} at ${proof.shop.email}. ` : '';
  return html`<p class="caption">${write}${decided || proof.arrival ? '' : `This link stays open until ${dateText(proof.expiresAt)}.`}</p>`;
}

/** The design, then the quote (when the shop added one), then the customer's answer; after shipping, the arrival questions. */
export function openProofPage(assets: Links, token: string, proof: PublicProofView, extras: PageExtras = {}): string {
  const action = `/proof/${encodeURIComponent(token)}`;
  const notice = extras.notice ? html`<p class="notice" role="alert" data-testid="proof-notice">${extras.notice}</p>` : '';
  if (proof.arrival) {
    const body = html`${notice}${arrivalSection(action, proof, proof.arrival, extras.arrivalDone ?? null, extras.problem)}${contact(proof, true)}`;
    return documentOf(assets, `How did it arrive? ${proof.jobTitle}`, body, false);
  }
  const parsed = parseLayout(proof.layout);
  const decided = proof.state === 'approved' || proof.state === 'changes_asked';
  const design = parsed.ok ? designSection(parsed.layout, proof.drawing, proof.pieces, proof.frame) : html`<p class="notice">The design could not be drawn here. Ask the shop to send it again.</p>`;
  const body = html`${notice}<p class="caption">${proof.shop.name} sent you this design</p>
<h1 data-testid="proof-title">${proof.jobTitle}</h1>
${proof.message ? html`<p data-testid="proof-message">${proof.message}</p>` : ''}
${design}
${proof.quote ? quoteSection(proof.quote) : ''}
${decided ? decisionShown(proof) : decisionForms(action, extras.problem)}
${contact(proof, decided)}`;
  return documentOf(assets, `Your framing proof: ${proof.jobTitle}`, body, parsed.ok && proof.drawing !== null);
}

/** The one page of every closed link: made up, revoked, replaced and expired read the same, byte for byte. */
export function closedPage(assets: Links): string {
  return documentOf(assets, PROOF_CLOSED_MESSAGE, html`<h1>${PROOF_CLOSED_MESSAGE}</h1><p class="notice info" data-testid="proof-closed">${PROOF_CLOSED_ADVICE}</p>`, false);
}

/** A page of plain words for anything else that stops the page (too many attempts, the server's own trouble). */
export function messagePage(assets: Links, heading: string, words: string): string {
  return documentOf(assets, heading, html`<h1>${heading}</h1><p class="notice" data-testid="proof-problem">${words}</p>`, false);
}
