/** The states, actions, stages and verdicts of a candidate's review (the state machine: reviews/state-machine.ts). */

export const REVIEW_STATES = [
  'proposed',
  'shortlisted',
  'in-chemistry-review',
  'in-regulatory-review',
  'approved',
  'changes-requested',
  'rejected',
] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

export const REVIEW_ACTIONS = [
  'shortlist',
  'unshortlist',
  'submit',
  'chemistry-approve',
  'chemistry-request-changes',
  'chemistry-reject',
  'regulatory-approve',
  'regulatory-request-changes',
  'regulatory-reject',
  'revise',
] as const;
export type ReviewAction = (typeof REVIEW_ACTIONS)[number];

export const REVIEW_STAGES = ['chemistry', 'regulatory'] as const;
export type ReviewStage = (typeof REVIEW_STAGES)[number];
export const REVIEW_VERDICTS = ['approved', 'changes-requested', 'rejected'] as const;
export type ReviewVerdict = (typeof REVIEW_VERDICTS)[number];
