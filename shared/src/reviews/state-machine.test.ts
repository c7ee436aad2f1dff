import { describe, expect, it } from 'vitest';
import { ROLES, type Role } from '../schemas/common';
import { REVIEW_ACTIONS, REVIEW_STATES, nextState, reviewAction, roleWaitedOn, type ReviewAction, type ReviewState } from './state-machine';

// The expected table, written out by hand from the review rules of the issue: proposed →
// shortlisted → in chemistry review → in regulatory review → approved; each review can send the
// candidate back (changes requested) or reject it; a change after changes are requested makes a
// new version that starts shortlisted. Designers (and administrators, who manage the workspace)
// shortlist, submit and revise; only chemists decide a chemistry review and only regulatory
// reviewers a regulatory review.
const EXPECTED: Record<ReviewAction, { from: ReviewState; to: ReviewState; roles: Role[] }> = {
  shortlist: { from: 'proposed', to: 'shortlisted', roles: ['designer', 'admin'] },
  unshortlist: { from: 'shortlisted', to: 'proposed', roles: ['designer', 'admin'] },
  submit: { from: 'shortlisted', to: 'in-chemistry-review', roles: ['designer', 'admin'] },
  'chemistry-approve': { from: 'in-chemistry-review', to: 'in-regulatory-review', roles: ['chemist'] },
  'chemistry-request-changes': { from: 'in-chemistry-review', to: 'changes-requested', roles: ['chemist'] },
  'chemistry-reject': { from: 'in-chemistry-review', to: 'rejected', roles: ['chemist'] },
  'regulatory-approve': { from: 'in-regulatory-review', to: 'approved', roles: ['reviewer'] },
  'regulatory-request-changes': { from: 'in-regulatory-review', to: 'changes-requested', roles: ['reviewer'] },
  'regulatory-reject': { from: 'in-regulatory-review', to: 'rejected', roles: ['reviewer'] },
  revise: { from: 'changes-requested', to: 'shortlisted', roles: ['designer', 'admin'] },
};

describe('review state machine: every transition × every role × every state', () => {
  for (const action of REVIEW_ACTIONS) {
    for (const role of ROLES) {
      for (const state of REVIEW_STATES) {
        const rule = EXPECTED[action];
        const expected = !rule.roles.includes(role) ? { error: 'forbidden' } : state === rule.from ? { to: rule.to } : { error: 'illegal' };
        it(`${action} by ${role} from ${state} → ${JSON.stringify(expected)}`, () => {
          expect(nextState(state, action, role)).toEqual(expected);
        });
      }
    }
  }

  it('approved and rejected are final: no action of any role leaves them', () => {
    for (const state of ['approved', 'rejected'] as const) {
      for (const action of REVIEW_ACTIONS) for (const role of ROLES) expect('to' in nextState(state, action, role)).toBe(false);
    }
  });

  it('a stage and a verdict name the action the API takes', () => {
    expect(reviewAction('chemistry', 'approved')).toBe('chemistry-approve');
    expect(reviewAction('chemistry', 'changes-requested')).toBe('chemistry-request-changes');
    expect(reviewAction('regulatory', 'rejected')).toBe('regulatory-reject');
  });

  it('each waiting state names the role that acts next', () => {
    expect(roleWaitedOn('in-chemistry-review')).toBe('chemist');
    expect(roleWaitedOn('in-regulatory-review')).toBe('reviewer');
    expect(roleWaitedOn('changes-requested')).toBe('designer');
    expect(roleWaitedOn('approved')).toBeNull();
  });
});
