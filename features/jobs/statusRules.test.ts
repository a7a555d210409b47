import { describe, expect, it } from 'vitest';
import { memberRoles } from '../auth/schema';
import { jobStatuses } from './schema';
import { statusChoices, statusMoveRefusal } from './statusRules';

// The shop's moves written out once more, by hand, as "from>to" (front desk and designers alike).
// Forward one step, back one step where work is redone, cancel before the piece leaves, reopen a cancelled job.
const handMoves = new Set([
  'taken_in>designing', 'taken_in>cancelled',
  'designing>taken_in', 'designing>cancelled',
  'awaiting_approval>designing', 'awaiting_approval>cancelled',
  'approved>designing', 'approved>cutting', 'approved>cancelled',
  'cutting>approved', 'cutting>assembling', 'cutting>cancelled',
  'assembling>cutting', 'assembling>ready', 'assembling>cancelled',
  'ready>assembling', 'ready>shipped', 'ready>collected', 'ready>cancelled',
  'cancelled>taken_in',
]);
// An owner may also approve by hand, with a reason, before the customer has answered a proof.
const ownerOverrides = new Set(['taken_in>approved', 'designing>approved', 'awaiting_approval>approved']);

describe('job status moves', () => {
  it('allows exactly the listed moves for every role, all 300 role-from-to triples', () => {
    for (const role of memberRoles) {
      for (const from of jobStatuses) {
        for (const to of jobStatuses) {
          const key = `${from}>${to}`;
          const allowed = handMoves.has(key) || (role === 'owner' && ownerOverrides.has(key));
          const refusal = statusMoveRefusal(from, to, role, 'Approved in person at the counter');
          expect(refusal === null, `${role}: ${key}`).toBe(allowed);
        }
      }
    }
  });

  it('a shipped job was not cancelled the day before, and a finished job never moves', () => {
    expect(statusMoveRefusal('cancelled', 'shipped', 'owner', undefined)?.kind).toBe('not_allowed');
    expect(statusMoveRefusal('shipped', 'cancelled', 'owner', undefined)?.message).toMatch(/finished job/);
    expect(statusMoveRefusal('collected', 'ready', 'owner', undefined)?.kind).toBe('not_allowed');
  });

  it('approval by hand needs an owner and a reason; waiting for approval comes only from a proof', () => {
    expect(statusMoveRefusal('designing', 'approved', 'designer', 'Looks fine')?.kind).toBe('owner_only');
    expect(statusMoveRefusal('designing', 'approved', 'owner', undefined)?.kind).toBe('reason_needed');
    expect(statusMoveRefusal('designing', 'awaiting_approval', 'owner', undefined)?.message).toMatch(/proof is sent/);
  });

  it('offers on screen exactly the moves the server accepts', () => {
    for (const role of memberRoles) {
      for (const from of jobStatuses) {
        const offered = statusChoices(from, role).map((c) => c.status).sort();
        const accepted = jobStatuses.filter((to) => statusMoveRefusal(from, to, role, 'reason') === null).sort();
        expect(offered, `${role} from ${from}`).toEqual(accepted);
      }
    }
  });
});
