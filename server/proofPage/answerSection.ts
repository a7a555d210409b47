import type { PublicProofView } from '../../features/proofs/schema';
import { PHOTO_MAX_BYTES } from '../../features/pieces/schema';
import { html, type SafeHtml } from './html';

/** Which form a mistake belongs to, its words per field, and what the customer had typed. */
export interface FormProblem {
  form: 'approve' | 'changes' | 'note' | 'photo';
  fields: Record<string, string>;
  /** A problem that is not one field's (shown above the form). */
  message?: string;
  values: { name?: string; comment?: string };
}

export const PHOTO_ACCEPT = 'image/jpeg,image/png,image/webp,image/avif,image/heic,image/heif';
export const PHOTO_RULES = `JPEG, PNG, WebP or AVIF, up to ${PHOTO_MAX_BYTES / (1024 * 1024)} MB`;

const longDate = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeZone: 'UTC' });
const dateAndTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeStyle: 'short', timeZone: 'UTC' });
export const dateText = (iso: string) => longDate.format(new Date(iso));
const whenText = (iso: string | null) => (iso ? `${dateAndTime.format(new Date(iso))} (UTC)` : '');

/** A field's message, tied to its input by id so a screen reader reads it with the field. */
export function fieldError(problem: FormProblem | undefined, form: FormProblem['form'], field: string): { message: string | null; id: string } {
  const message = problem?.form === form ? (problem.fields[field] ?? null) : null;
  return { message, id: `${form}-${field}-error` };
}

export function errorLine(error: { message: string | null; id: string }): SafeHtml {
  return error.message ? html`<p class="field-error" id="${error.id}">${error.message}</p>` : html``;
}

export const invalidAttrs = (error: { message: string | null; id: string }) => (error.message ? html` aria-invalid="true" aria-describedby="${error.id}"` : html``);

export function formMessage(problem: FormProblem | undefined, form: FormProblem['form']): SafeHtml {
  return problem?.form === form && problem.message ? html`<p class="notice" role="alert">${problem.message}</p>` : html``;
}

function approveForm(action: string, problem?: FormProblem): SafeHtml {
  const name = fieldError(problem, 'approve', 'name');
  return html`<form method="post" action="${action}" data-testid="approve-form"><fieldset><legend>Approve this design</legend>${formMessage(problem, 'approve')}
<input type="hidden" name="decision" value="approve">
<label for="proof-name">Your name</label><p class="caption" id="proof-name-hint">Typing your name approves the design as shown.</p>
<input type="text" id="proof-name" name="name" autocomplete="name" maxlength="120" value="${problem?.form === 'approve' ? (problem.values.name ?? '') : ''}" data-testid="proof-name"${invalidAttrs(name)}>${errorLine(name)}
<button type="submit" data-testid="proof-approve">Approve the design</button></fieldset></form>`;
}

function changesForm(action: string, problem?: FormProblem): SafeHtml {
  const comment = fieldError(problem, 'changes', 'comment');
  const photo = fieldError(problem, 'changes', 'photo');
  return html`<form method="post" action="${action}" enctype="multipart/form-data" data-testid="changes-form"><fieldset><legend>Ask for changes</legend>${formMessage(problem, 'changes')}
<input type="hidden" name="decision" value="changes">
<label for="proof-comment">What should change?</label>
<textarea id="proof-comment" name="comment" rows="4" maxlength="2000" data-testid="proof-comment"${invalidAttrs(comment)}>${problem?.form === 'changes' ? (problem.values.comment ?? '') : ''}</textarea>${errorLine(comment)}
<label for="proof-sketch">A photo of your sketch or note (optional)</label><p class="caption">${PHOTO_RULES}.</p>
<input type="file" id="proof-sketch" name="photo" accept="${PHOTO_ACCEPT}" data-testid="proof-sketch"${invalidAttrs(photo)}>${errorLine(photo)}
<button type="submit" data-testid="proof-send-changes">Send my changes</button></fieldset></form>`;
}

/** The customer's one answer: approve with a typed name, or say what should change; both forms work without script. */
export function decisionForms(action: string, problem?: FormProblem): SafeHtml {
  return html`<section class="card-part" aria-labelledby="answer-heading" id="answer"><h2 id="answer-heading">Your answer</h2>
${approveForm(action, problem)}
${changesForm(action, problem)}
<p class="caption">You can answer once. After that, write to the shop if something changes.</p></section>`;
}

/** What the customer answered, shown instead of the forms once decided. */
export function decisionShown(proof: PublicProofView): SafeHtml {
  const when = whenText(proof.decidedAt);
  const body =
    proof.state === 'approved'
      ? html`<strong>You approved this design</strong>Approved by ${proof.approvedName ?? ''} on ${when}. The shop will go ahead with it.`
      : html`<strong>You asked for changes</strong>On ${when} you wrote: “${proof.changesComment ?? ''}”.${proof.changesPhotoSent ? ' Your photo went with it.' : ''} The shop will send you a new proof.`;
  return html`<section id="answer" aria-label="Your answer"><div class="notice info" data-testid="proof-answered">${body}</div></section>`;
}
