import type { PublicProofView } from '../../features/proofs/schema';
import { html, type SafeHtml } from './html';
import { errorLine, fieldError, formMessage, invalidAttrs, PHOTO_ACCEPT, PHOTO_RULES, type FormProblem } from './answerSection';

type Arrival = NonNullable<PublicProofView['arrival']>;

/** What a finished arrival post says on the page it redirects to. */
export type ArrivalDone = 'note' | 'photo' | null;

function noteForm(action: string, arrival: Arrival, shopName: string, done: ArrivalDone, problem?: FormProblem): SafeHtml {
  const comment = fieldError(problem, 'note', 'comment');
  const typed = problem?.form === 'note' ? (problem.values.comment ?? '') : (arrival.comment ?? '');
  return html`<form method="post" action="${action}/arrival" id="arrival-note" data-testid="arrival-note-form">${formMessage(problem, 'note')}
<label for="arrival-comment">Your note to the shop</label>
<textarea id="arrival-comment" name="comment" rows="4" maxlength="2000" data-testid="arrival-comment-field"${invalidAttrs(comment)}>${typed}</textarea>${errorLine(comment)}
<button type="submit" data-testid="arrival-send">${arrival.comment ? 'Update the note' : 'Send the note'}</button>
${done === 'note' ? html`<p role="status" data-testid="arrival-thanks">Thank you, ${shopName} has your note.</p>` : ''}</form>`;
}

function photoForm(action: string, arrival: Arrival, done: ArrivalDone, problem?: FormProblem): SafeHtml {
  const photo = fieldError(problem, 'photo', 'photo');
  const room = arrival.maxPhotos - arrival.photos.length;
  const own = arrival.photos.map((p, i) => html`<img src="${p.url}" width="110" height="110" alt="Your photo ${i + 1} of the frame" data-testid="arrival-own-photo">`);
  const form =
    room > 0
      ? html`<form method="post" action="${action}/arrival/photos" enctype="multipart/form-data" data-testid="arrival-photo-form">${formMessage(problem, 'photo')}
<label for="arrival-photo">${arrival.photos.length ? 'Add another photo' : 'Add a photo'}</label>
<input type="file" id="arrival-photo" name="photo" accept="${PHOTO_ACCEPT}" required data-testid="arrival-photo-file"${invalidAttrs(photo)}>${errorLine(photo)}
<button type="submit" class="secondary" data-testid="arrival-add-photo">Send the photo</button></form>`
      : html`<p class="caption">Thank you for the photos.</p>`;
  return html`<h2 id="arrival-photo">Your photos</h2>${own.length ? html`<div class="photos">${own}</div>` : ''}
${done === 'photo' ? html`<p role="status" data-testid="arrival-photo-thanks">Thank you, your photo is with the shop.</p>` : ''}${form}
<p class="caption">Up to ${arrival.maxPhotos} photos, ${PHOTO_RULES} each.</p>`;
}

/** After delivery the proof's link asks how the frame arrived: a note and up to three photos, then how to hang it. */
export function arrivalSection(action: string, proof: PublicProofView, arrival: Arrival, done: ArrivalDone, problem?: FormProblem): SafeHtml {
  return html`<p class="caption">${proof.jobTitle}</p>
<h1>How did it arrive?</h1>
<div class="card-part" data-testid="arrival-form">
<p>${proof.shop.name} shipped your frame. Tell them how it came through, and show it on your wall or in its box if you like.</p>
${noteForm(action, arrival, proof.shop.name, done, problem)}
${photoForm(action, arrival, done, problem)}
<div class="notice info"><strong>Hanging it</strong>Hang a heavy frame from two hangers into studs, or into anchors rated for at least twice its weight, following local building codes; ask a licensed installer if unsure.</div>
</div>`;
}
