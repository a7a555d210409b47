import type { MemberRole } from '../auth/schema';
import { jobStatusLabels, type JobStatus } from './schema';

/**
 * The moves a member may make by hand, in the order work goes through the shop, plus the
 * steps back a framer needs (a mat recut, a frame reopened). Two statuses are never chosen by hand:
 * "waiting for approval" comes from sending a proof, and "approved" from the customer's approval on
 * the proof, or from an owner who overrides with a reason. Shipped and collected are final; a
 * cancelled job can only be reopened as taken in.
 */
export const manualStatusMoves: Readonly<Record<JobStatus, readonly JobStatus[]>> = {
  taken_in: ['designing', 'cancelled'],
  designing: ['taken_in', 'cancelled'],
  awaiting_approval: ['designing', 'cancelled'],
  approved: ['designing', 'cutting', 'cancelled'],
  cutting: ['approved', 'assembling', 'cancelled'],
  assembling: ['cutting', 'ready', 'cancelled'],
  ready: ['assembling', 'shipped', 'collected', 'cancelled'],
  shipped: [],
  collected: [],
  cancelled: ['taken_in'],
};

/** Where an owner may mark a job approved without an approved proof (with a reason). */
export const overridableToApproved: readonly JobStatus[] = ['taken_in', 'designing', 'awaiting_approval'];

/** Statuses from which a proof may be sent: the design is still open to the customer's say. */
export const proofSendableStatuses: readonly JobStatus[] = ['taken_in', 'designing', 'awaiting_approval', 'approved'];

export type StatusMoveRefusal =
  | { readonly kind: 'same' | 'not_allowed' | 'owner_only'; readonly message: string }
  | { readonly kind: 'reason_needed'; readonly message: string };

/** Moves a member of `role` may pick from `from`, with whether each needs a reason. */
export function statusChoices(from: JobStatus, role: MemberRole): { status: JobStatus; needsReason: boolean }[] {
  const choices = manualStatusMoves[from].map((status) => ({ status, needsReason: false }));
  if (role === 'owner' && overridableToApproved.includes(from)) choices.push({ status: 'approved', needsReason: true });
  return choices;
}

/** Why a hand move is refused, or null when it is allowed. `reason` is the note the member typed. */
export function statusMoveRefusal(from: JobStatus, to: JobStatus, role: MemberRole, reason: string | undefined): StatusMoveRefusal | null {
  if (from === to) return { kind: 'same', message: 'The job already has that status' };
  if (to === 'approved' && overridableToApproved.includes(from)) {
    if (role !== 'owner') {
      return { kind: 'owner_only', message: 'A job is approved by the customer on a proof; only an owner can mark it approved without one' };
    }
    if (!reason) return { kind: 'reason_needed', message: 'Say why the job is approved without an approved proof' };
    return null;
  }
  if (manualStatusMoves[from].includes(to)) return null;
  return { kind: 'not_allowed', message: notAllowedMessage(from, to) };
}

function notAllowedMessage(from: JobStatus, to: JobStatus): string {
  const fromLabel = jobStatusLabels[from].toLowerCase();
  const toLabel = jobStatusLabels[to].toLowerCase();
  if (to === 'awaiting_approval') return 'A job waits for approval when a proof is sent: send one from the proofs section';
  if (from === 'shipped' || from === 'collected') return `The job is ${fromLabel}; a finished job does not move again`;
  if (from === 'cancelled') return 'A cancelled job can only be reopened as taken in';
  const next = manualStatusMoves[from].map((s) => jobStatusLabels[s].toLowerCase());
  return `A job that is ${fromLabel} cannot move to ${toLabel}; it can move to ${next.join(', ')}`;
}
