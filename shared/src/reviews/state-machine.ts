import type { Role } from '../schemas/common';

/**
 * The review and sign-off of a candidate, as a pure state machine.
 *
 *   proposed ⇄ shortlisted → in-chemistry-review → in-regulatory-review → approved
 *                                   ↓ ↘                   ↓ ↘
 *                         changes-requested  rejected   changes-requested  rejected
 *   changes-requested —revise→ a new version (revision + 1) that starts shortlisted.
 *
 * Each action belongs to roles: designers (and administrators) shortlist, submit and revise;
 * only chemists decide a chemistry review and only regulatory reviewers a regulatory review, so
 * one person cannot sign both stages by holding the administrator role.
 */

// The states, actions, stages and verdicts are data of the API's schemas (schemas/review-states.ts).
export { REVIEW_ACTIONS, REVIEW_STAGES, REVIEW_STATES, REVIEW_VERDICTS } from '../schemas/review-states';
export type { ReviewAction, ReviewStage, ReviewState, ReviewVerdict } from '../schemas/review-states';
import type { ReviewAction, ReviewStage, ReviewState, ReviewVerdict } from '../schemas/review-states';

export interface Transition {
  action: ReviewAction;
  from: ReviewState;
  /** For `revise`: the state the new version starts in (the old version keeps its state). */
  to: ReviewState;
  roles: readonly Role[];
}

const DESIGNERS: readonly Role[] = ['designer', 'admin'];
const CHEMISTS: readonly Role[] = ['chemist'];
const REVIEWERS: readonly Role[] = ['reviewer'];

/** Every legal transition: from which state, to which, and who may take it. */
export const REVIEW_TRANSITIONS: readonly Transition[] = [
  { action: 'shortlist', from: 'proposed', to: 'shortlisted', roles: DESIGNERS },
  { action: 'unshortlist', from: 'shortlisted', to: 'proposed', roles: DESIGNERS },
  { action: 'submit', from: 'shortlisted', to: 'in-chemistry-review', roles: DESIGNERS },
  { action: 'chemistry-approve', from: 'in-chemistry-review', to: 'in-regulatory-review', roles: CHEMISTS },
  { action: 'chemistry-request-changes', from: 'in-chemistry-review', to: 'changes-requested', roles: CHEMISTS },
  { action: 'chemistry-reject', from: 'in-chemistry-review', to: 'rejected', roles: CHEMISTS },
  { action: 'regulatory-approve', from: 'in-regulatory-review', to: 'approved', roles: REVIEWERS },
  { action: 'regulatory-request-changes', from: 'in-regulatory-review', to: 'changes-requested', roles: REVIEWERS },
  { action: 'regulatory-reject', from: 'in-regulatory-review', to: 'rejected', roles: REVIEWERS },
  { action: 'revise', from: 'changes-requested', to: 'shortlisted', roles: DESIGNERS },
];

/** The action a review decision takes: stage + verdict, e.g. `chemistry` + `approved` → `chemistry-approve`. */
export function reviewAction(stage: ReviewStage, verdict: ReviewVerdict): ReviewAction {
  const suffix = verdict === 'approved' ? 'approve' : verdict === 'changes-requested' ? 'request-changes' : 'reject';
  return `${stage}-${suffix}` as ReviewAction;
}

/** Roles that may ever take an action (whatever the state). */
export function rolesFor(action: ReviewAction): readonly Role[] {
  return REVIEW_TRANSITIONS.find((t) => t.action === action)?.roles ?? [];
}

/**
 * Where an action leads from a state for a role.
 *
 * `forbidden` when the role may never take this action (the API answers 403); `illegal` when the
 * role may, but not from this state (409). The role is checked first, so a wrong role learns
 * nothing about the state.
 *
 * Example: `nextState('in-chemistry-review', 'chemistry-approve', 'chemist')` → `{ to: 'in-regulatory-review' }`;
 * the same for `'reviewer'` → `{ error: 'forbidden' }`; `nextState('approved', 'submit', 'designer')` → `{ error: 'illegal' }`.
 */
export function nextState(state: ReviewState, action: ReviewAction, role: Role): { to: ReviewState } | { error: 'forbidden' | 'illegal' } {
  if (!rolesFor(action).includes(role)) return { error: 'forbidden' };
  const t = REVIEW_TRANSITIONS.find((x) => x.action === action && x.from === state);
  return t ? { to: t.to } : { error: 'illegal' };
}

/** States from which the composition can no longer change (a change makes a new version). */
export const FROZEN_STATES: readonly ReviewState[] = ['in-chemistry-review', 'in-regulatory-review', 'approved', 'changes-requested', 'rejected'];

/** A candidate in or past review: it has a dossier. */
export function isInOrPastReview(state: string): boolean {
  return (FROZEN_STATES as readonly string[]).includes(state);
}

/** Which role acts next in a state (for the "waiting for you" lists and the e-mails). */
export function roleWaitedOn(state: ReviewState): 'chemist' | 'reviewer' | 'designer' | null {
  if (state === 'in-chemistry-review') return 'chemist';
  if (state === 'in-regulatory-review') return 'reviewer';
  if (state === 'changes-requested') return 'designer';
  return null;
}

export const REVIEW_STATE_LABELS: Record<ReviewState, string> = {
  proposed: 'Proposed',
  shortlisted: 'Shortlisted',
  'in-chemistry-review': 'In chemistry review',
  'in-regulatory-review': 'In regulatory review',
  approved: 'Approved',
  'changes-requested': 'Changes requested',
  rejected: 'Rejected',
};
