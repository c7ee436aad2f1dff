import type { Role } from '@shared/schemas';
import { REVIEW_STATE_LABELS, type ReviewStage, type ReviewState, type ReviewVerdict } from '@shared/reviews/state-machine';
import { appUrl } from '../app-url';
import type { AuthUser } from '../auth/session-user';
import type { CandidateRecord } from '../candidates/candidate.model';
import { sendMail } from '../mail/mailer';
import { linkMail } from '../mail/templates';
import { UserRecord } from '../users/user.model';

export interface TransitionNotice {
  actor: AuthUser;
  candidate: CandidateRecord;
  from: string;
  to: ReviewState;
  comment: string;
  kind: 'submitted' | 'review' | 'revised';
  stage?: ReviewStage;
  verdict?: ReviewVerdict;
  newCandidateId?: number;
}

async function activeMembers(workspaceId: number, role: Role) {
  return UserRecord.findAll({ where: { workspaceId, role, disabled: false }, attributes: ['id', 'email', 'name'] });
}

/**
 * Who hears of a transition: the chemists when a candidate is submitted, the regulatory reviewers
 * when chemistry approves, and the designer who submitted it when changes are requested, it is
 * rejected or it is approved. A revision starts shortlisted with its designer, so nobody else is
 * mailed until it is submitted again. The actor is never mailed about their own step.
 */
async function recipients(n: TransitionNotice): Promise<{ email: string; name: string }[]> {
  let people: { id: number; email: string; name: string }[] = [];
  if (n.to === 'in-chemistry-review') people = await activeMembers(n.actor.workspaceId, 'chemist');
  else if (n.to === 'in-regulatory-review') people = await activeMembers(n.actor.workspaceId, 'reviewer');
  else if (n.kind === 'review' && n.candidate.submittedById) {
    people = await UserRecord.findAll({ where: { id: n.candidate.submittedById, workspaceId: n.actor.workspaceId, disabled: false }, attributes: ['id', 'email', 'name'] });
  }
  return people.filter((p) => p.id !== n.actor.id).map((p) => ({ email: p.email, name: p.name }));
}

function subjectAndLines(n: TransitionNotice): { subject: string; lines: string[] } {
  const what = `${n.candidate.data.setNames.join(' + ')} (candidate ${n.candidate.id}, revision ${n.candidate.revision})`;
  const comment = n.comment ? [`Comment from ${n.actor.name}: “${n.comment}”`] : [];
  const moved = `${REVIEW_STATE_LABELS[n.from as ReviewState] ?? n.from} → ${REVIEW_STATE_LABELS[n.to]}`;
  switch (n.to) {
    case 'in-chemistry-review':
      return { subject: `Chemistry review waiting: ${what}`, lines: [`${n.actor.name} submitted ${what} for review (${moved}).`, 'It waits for a chemist: check the data sources, whether the model holds in this regime, and the lab log.', ...comment] };
    case 'in-regulatory-review':
      return { subject: `Regulatory review waiting: ${what}`, lines: [`${n.actor.name} approved the chemistry of ${what} (${moved}).`, 'It waits for a regulatory reviewer: classification, label elements, cautions and regulatory flags.', ...comment] };
    case 'approved':
      return { subject: `Approved: ${what}`, lines: [`${n.actor.name} signed off the regulatory review of ${what} (${moved}). Its dossier is ready to print.`, ...comment] };
    case 'changes-requested':
      return { subject: `Changes requested: ${what}`, lines: [`${n.actor.name} asked for changes in the ${n.stage ?? ''} review of ${what} (${moved}).`, 'Revise it to make a new version, then submit that again.', ...comment] };
    case 'rejected':
      return { subject: `Rejected: ${what}`, lines: [`${n.actor.name} rejected ${what} in the ${n.stage ?? ''} review (${moved}).`, ...comment] };
    default:
      return { subject: `Candidate update: ${what}`, lines: [`${n.actor.name}: ${moved}.`, ...comment] };
  }
}

/**
 * E-mails the people of the next role about a transition, with a link to the candidate.
 * Sent after the transition committed; a mail failure is logged and does not undo the decision.
 */
export async function notifyTransition(n: TransitionNotice): Promise<void> {
  const people = await recipients(n);
  if (people.length === 0) return;
  const { subject, lines } = subjectAndLines(n);
  const link = appUrl(`/candidates/${n.candidate.id}`);
  await Promise.all(
    people.map(async (p) => {
      const body = linkMail({ greeting: `Hello ${p.name},`, lines, linkLabel: 'Open the candidate', link, footer: 'You receive this because of your role in this Packwright workspace.' });
      try {
        await sendMail({ to: p.email, subject, text: body.text, html: body.html, workspaceId: n.actor.workspaceId });
      } catch (error) {
        console.error(`review mail to ${p.email} failed:`, error instanceof Error ? error.message : error);
      }
    }),
  );
}
