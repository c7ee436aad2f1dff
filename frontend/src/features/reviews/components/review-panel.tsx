import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Link, useNavigate } from 'react-router';
import type { CandidateRecord } from '@shared/schemas/runs';
import {
  CHEMISTRY_CHECKLIST_LABELS,
  REGULATORY_CHECKLIST_LABELS,
  reviewDecisionRequestSchema,
  reviseRequestSchema,
  type ReviewEvent,
} from '@shared/schemas/reviews';
import { REVIEW_STATE_LABELS, isInOrPastReview, nextState, type ReviewState } from '@shared/reviews/state-machine';
import type { Role } from '@shared/schemas/common';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { fieldErrorText } from '@/components/ui/field';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { isApiError } from '@/lib/api-client';
import { formatDateTime, formatNumber } from '@/lib/format';
import { useReviewHistory } from '../api/get-review-history';
import { useDecideReview, useReviseCandidate, useSubmitCandidate, type DecisionBody } from '../api/mutate-review';
import { ReviewStateBadge } from './review-state-badge';

const textareaClasses = 'block w-full rounded-control border border-ink-200 bg-surface px-3 py-2 text-body text-ink-900';

function ErrorLine({ id, label, message }: { id?: string; label: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="text-caption font-semibold text-rust-600">
      {fieldErrorText(label, message)}
    </p>
  );
}

/** Errors by field from the shared schema's issues or the server's 400. */
function fieldMap(issues: { path: PropertyKey[]; message: string }[]): Record<string, string> {
  return Object.fromEntries(issues.map((i) => [i.path.map(String).join('.'), i.message]));
}

function SubmitForm({ candidateId }: { candidateId: number }) {
  const submit = useSubmitCandidate(candidateId);
  const [comment, setComment] = useState('');
  return (
    <form
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        submit.mutate({ comment });
      }}
    >
      <p className="text-small text-ink-700">Submitting sends the candidate to the chemists. Its composition is frozen from then on; a later change makes a new version.</p>
      <div className="flex flex-col gap-1.5">
        <label htmlFor="submit-comment" className="text-small font-semibold text-ink-800">
          Note for the reviewers (optional)
        </label>
        <textarea id="submit-comment" rows={2} className={textareaClasses} value={comment} onChange={(e) => setComment(e.target.value)} />
      </div>
      {submit.isError && <Alert tone="danger">{submit.error.message}</Alert>}
      <div>
        <Button type="submit" pending={submit.isPending} pendingLabel="Submitting…">
          Submit for review
        </Button>
      </div>
    </form>
  );
}

type ChecklistForm = Record<string, boolean | string> & { comment: string; labLogMode: '' | 'attached' | 'waived'; waivedReason: string };

/** The checklist of a review stage, a comment, and the three decisions. */
function DecisionForm({ candidateId, stage }: { candidateId: number; stage: 'chemistry' | 'regulatory' }) {
  const decide = useDecideReview(candidateId);
  const form = useForm<ChecklistForm>({ defaultValues: { comment: '', labLogMode: '', waivedReason: '' } as ChecklistForm });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const labels: Record<string, string> = stage === 'chemistry' ? CHEMISTRY_CHECKLIST_LABELS : REGULATORY_CHECKLIST_LABELS;
  const boxes = Object.keys(labels).filter((k) => k !== 'labLog');
  const labLogMode = useWatch({ control: form.control, name: 'labLogMode' });

  const send = (verdict: DecisionBody['verdict']) =>
    form.handleSubmit((values) => {
      const checklist: Record<string, unknown> = Object.fromEntries(boxes.map((k) => [k, values[k] === true]));
      if (stage === 'chemistry') {
        if (values.labLogMode === 'attached') checklist.labLog = { attached: true };
        else if (values.labLogMode === 'waived') checklist.labLog = { waivedReason: values.waivedReason };
      }
      const body: DecisionBody = { stage, verdict, checklist, comment: values.comment };
      // The same schema the server validates with: comment unless approved, every item to approve.
      const parsed = reviewDecisionRequestSchema.safeParse(body);
      if (!parsed.success) {
        setErrors(fieldMap(parsed.error.issues));
        return;
      }
      setErrors({});
      decide.mutate(body, {
        onError: (error) => {
          if (isApiError(error) && error.fields.length) setErrors(Object.fromEntries(error.fields.map((f) => [f.field, f.message])));
        },
      });
    })();

  const title = stage === 'chemistry' ? 'Chemistry review' : 'Regulatory review';
  return (
    <form className="flex flex-col gap-4" aria-label={title} onSubmit={(e) => e.preventDefault()}>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-small font-semibold text-ink-800">{title} checklist (all items to approve)</legend>
        {boxes.map((k) => (
          <div key={k}>
            <label className="flex items-center gap-2 text-body">
              <input type="checkbox" className="size-4" {...form.register(k)} aria-describedby={errors[`checklist.${k}`] ? `err-${k}` : undefined} />
              {labels[k]}
            </label>
            <ErrorLine id={`err-${k}`} label={labels[k]!} message={errors[`checklist.${k}`]} />
          </div>
        ))}
        {stage === 'chemistry' && (
          <fieldset className="mt-1 flex flex-col gap-1.5 rounded-control border border-ink-100 px-3 py-2">
            <legend className="px-1 text-small font-semibold text-ink-800">Lab log</legend>
            <label className="flex items-center gap-2">
              <input type="radio" value="attached" {...form.register('labLogMode')} /> A lab log is attached
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" value="waived" {...form.register('labLogMode')} /> Waived, with a reason
            </label>
            {labLogMode === 'waived' && (
              <div className="flex flex-col gap-1">
                <label htmlFor="waived-reason" className="text-small font-semibold text-ink-800">
                  Reason for waiving the lab log
                </label>
                <input id="waived-reason" className={`${textareaClasses} h-10`} {...form.register('waivedReason')} />
              </div>
            )}
            <ErrorLine label="Lab log" message={errors['checklist.labLog']} />
          </fieldset>
        )}
      </fieldset>
      <div className="flex flex-col gap-1.5">
        <label htmlFor={`${stage}-comment`} className="text-small font-semibold text-ink-800">
          Comment (required unless you approve)
        </label>
        <textarea id={`${stage}-comment`} rows={3} className={textareaClasses} {...form.register('comment')} aria-invalid={errors.comment ? true : undefined} />
        <ErrorLine label="Comment" message={errors.comment} />
      </div>
      {decide.isError && !(isApiError(decide.error) && decide.error.fields.length) && <Alert tone="danger">{decide.error.message}</Alert>}
      <div className="flex flex-wrap gap-2">
        <Button type="button" pending={decide.isPending && decide.variables?.verdict === 'approved'} onClick={() => void send('approved')}>
          Approve
        </Button>
        <Button type="button" variant="secondary" pending={decide.isPending && decide.variables?.verdict === 'changes-requested'} onClick={() => void send('changes-requested')}>
          Request changes
        </Button>
        <Button type="button" variant="danger" pending={decide.isPending && decide.variables?.verdict === 'rejected'} onClick={() => void send('rejected')}>
          Reject
        </Button>
      </div>
    </form>
  );
}

/** After changes were requested: edit the grams and make a new version (re-checked by the time model). */
function ReviseForm({ candidate }: { candidate: CandidateRecord }) {
  const revise = useReviseCandidate(candidate.id);
  const navigate = useNavigate();
  const lines = candidate.composition.filter((c) => c.massG > 0);
  const [masses, setMasses] = useState<Record<string, string>>(() => Object.fromEntries(lines.map((l) => [l.ingredientId, String(Number(l.massG.toFixed(2)))])));
  const [comment, setComment] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  return (
    <form
      className="flex flex-col gap-3"
      aria-label="Revise the composition"
      onSubmit={(e) => {
        e.preventDefault();
        const body = { composition: lines.map((l) => ({ ingredientId: Number(l.ingredientId), massG: Number(masses[l.ingredientId]) })), comment };
        const parsed = reviseRequestSchema.safeParse(body);
        if (!parsed.success) {
          setErrors(fieldMap(parsed.error.issues));
          return;
        }
        setErrors({});
        revise.mutate(body, {
          onSuccess: (res) => void navigate(`/candidates/${res.candidate.id}`),
          onError: (error) => {
            if (isApiError(error) && error.fields.length) setErrors(Object.fromEntries(error.fields.map((f) => [f.field, f.message])));
          },
        });
      }}
    >
      <p className="text-small text-ink-700">Edit the grams (0 g leaves an ingredient out). The new version is re-checked with the time model and starts shortlisted; submit it again when it is ready.</p>
      <table className="w-full text-small">
        <thead>
          <tr className="text-left text-ink-600">
            <th scope="col" className="py-1 pr-3 font-semibold">Ingredient</th>
            <th scope="col" className="py-1 font-semibold">Mass (g)</th>
          </tr>
        </thead>
        <tbody>
          {lines.map((l, k) => (
            <tr key={l.ingredientId} className="border-t border-ink-100">
              <td className="py-1.5 pr-3">
                <label htmlFor={`mass-${l.ingredientId}`}>{l.name}</label>
              </td>
              <td className="py-1.5">
                <input
                  id={`mass-${l.ingredientId}`}
                  inputMode="decimal"
                  className="h-9 w-28 rounded-control border border-ink-200 px-2 tabular-nums"
                  value={masses[l.ingredientId] ?? ''}
                  onChange={(e) => setMasses((m) => ({ ...m, [l.ingredientId]: e.target.value }))}
                />
                <ErrorLine label="Mass (g)" message={errors[`composition.${k}.massG`]} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <ErrorLine label="Composition" message={errors.composition} />
      <div className="flex flex-col gap-1.5">
        <label htmlFor="revise-comment" className="text-small font-semibold text-ink-800">
          What changed (optional)
        </label>
        <textarea id="revise-comment" rows={2} className={textareaClasses} value={comment} onChange={(e) => setComment(e.target.value)} />
      </div>
      {revise.isError && !(isApiError(revise.error) && revise.error.fields.length) && <Alert tone="danger">{revise.error.message}</Alert>}
      <div>
        <Button type="submit" pending={revise.isPending} pendingLabel="Re-checking…">
          Make a revised version
        </Button>
      </div>
    </form>
  );
}

function eventLine(e: ReviewEvent): string {
  const moved = `${REVIEW_STATE_LABELS[e.from as ReviewState] ?? e.from} → ${REVIEW_STATE_LABELS[e.to as ReviewState] ?? e.to}`;
  if (e.kind === 'submitted') return `Submitted for review (${moved})`;
  if (e.kind === 'revised') return `Revised into a new version (${moved} for the new version)`;
  const r = e.review!;
  const verdict = r.verdict === 'approved' ? 'approved' : r.verdict === 'changes-requested' ? 'requested changes' : 'rejected';
  return `${r.stage === 'chemistry' ? 'Chemistry' : 'Regulatory'} review: ${verdict} (${moved})`;
}

/** Oldest first, across the candidate's versions. */
export function ReviewTimeline({ events, currentId }: { events: readonly ReviewEvent[]; currentId: number }) {
  if (events.length === 0) return <p className="text-small text-ink-600">No review steps yet.</p>;
  return (
    <ol className="flex flex-col gap-3 border-l-2 border-ink-100 pl-4" aria-label="Review history">
      {events.map((e, k) => (
        <li key={k} className="break-inside-avoid">
          <p className="text-small font-semibold text-ink-900">
            {eventLine(e)}
            {e.candidateId !== currentId && <span className="font-normal text-ink-500"> · revision {e.revision}</span>}
          </p>
          <p className="text-caption text-ink-500">
            {e.actor}
            {e.actorRole ? ` (${e.actorRole})` : ''} · {formatDateTime(e.at)}
          </p>
          {e.comment && <p className="mt-0.5 text-small text-ink-800">“{e.comment}”</p>}
          {e.review && Object.keys(e.review.checklist).length > 0 && (
            <p className="mt-0.5 text-caption text-ink-600">
              Checklist:{' '}
              {Object.entries(e.review.checklist)
                .map(([k, v]) => {
                  const label = (CHEMISTRY_CHECKLIST_LABELS as Record<string, string>)[k] ?? (REGULATORY_CHECKLIST_LABELS as Record<string, string>)[k] ?? k;
                  if (k === 'labLog' && v && typeof v === 'object') return 'attached' in v ? `lab log ${(v as { attached: boolean }).attached ? 'attached' : 'not attached'}` : `lab log waived: ${(v as { waivedReason: string }).waivedReason}`;
                  return `${label} ${v === true ? '✓' : '✗'}`;
                })
                .join(' · ')}
            </p>
          )}
          {e.kind === 'revised' && e.newCandidateId && (
            <Link to={`/candidates/${e.newCandidateId}`} className="text-small font-semibold text-frost-700 hover:underline">
              Open the new version
            </Link>
          )}
        </li>
      ))}
    </ol>
  );
}

/**
 * The candidate's review: its state, the action the signed-in role can take now (submit, a
 * checklist decision, revise), and the history of every version.
 */
export function ReviewPanel({ candidate, role }: { candidate: CandidateRecord; role: Role }) {
  const history = useReviewHistory(candidate.id);
  if (history.isPending) return <Loading label="Loading the review…" />;
  if (history.isError) return <QueryError title="The review could not be loaded" error={history.error} onRetry={() => void history.refetch()} retrying={history.isFetching} />;
  const { status, events } = history.data;
  const can = (action: Parameters<typeof nextState>[1]) => 'to' in nextState(status.state, action, role);
  return (
    <Card>
      <CardHeader
        id="review-heading"
        title="Review and sign-off"
        description={`Revision ${status.revision}${status.submittedBy ? ` · submitted by ${status.submittedBy} ${formatDateTime(status.submittedAt)}` : ''}`}
        action={<ReviewStateBadge state={status.state} />}
      />
      <CardBody className="flex flex-col gap-5">
        {status.parentCandidateId && (
          <p className="text-small text-ink-700">
            This version revises <Link className="font-semibold text-frost-700 hover:underline" to={`/candidates/${status.parentCandidateId}`}>candidate {status.parentCandidateId}</Link>.
          </p>
        )}
        {status.childCandidateId && (
          <Alert tone="info" title="A newer version exists">
            <Link className="font-semibold text-frost-700 hover:underline" to={`/candidates/${status.childCandidateId}`}>
              Open candidate {status.childCandidateId}
            </Link>
          </Alert>
        )}
        {can('submit') && <SubmitForm candidateId={candidate.id} />}
        {status.state === 'proposed' && (role === 'designer' || role === 'admin') && <p className="text-small text-ink-700">Shortlist this candidate from its run to submit it for review.</p>}
        {can('chemistry-approve') && <DecisionForm candidateId={candidate.id} stage="chemistry" />}
        {can('regulatory-approve') && <DecisionForm candidateId={candidate.id} stage="regulatory" />}
        {can('revise') && !status.childCandidateId && <ReviseForm candidate={candidate} />}
        {!can('submit') && !can('chemistry-approve') && !can('regulatory-approve') && !(can('revise') && !status.childCandidateId) && status.state !== 'proposed' && (
          <p className="text-small text-ink-600">
            {status.state === 'in-chemistry-review'
              ? 'Waiting for a chemist.'
              : status.state === 'in-regulatory-review'
                ? 'Waiting for a regulatory reviewer.'
                : status.state === 'changes-requested'
                  ? 'Waiting for the designer to revise it.'
                  : status.state === 'approved'
                    ? 'Signed off by chemistry and regulatory review.'
                    : status.state === 'rejected'
                      ? 'Rejected; it stays on record with its dossier.'
                      : 'Nothing for your role to do here.'}
          </p>
        )}
        {isInOrPastReview(status.state) && (
          <div>
            <ButtonLink to={`/candidates/${candidate.id}/dossier`} variant="secondary" size="sm">
              Open the dossier
            </ButtonLink>
          </div>
        )}
        <section aria-labelledby="history-heading">
          <h3 id="history-heading" className="mb-2 text-body font-bold text-ink-900">
            History
          </h3>
          <ReviewTimeline events={events} currentId={candidate.id} />
        </section>
        <p className="sr-only">{formatNumber(events.length)} steps.</p>
      </CardBody>
    </Card>
  );
}
