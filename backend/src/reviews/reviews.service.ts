import { Op, QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import type { z } from 'zod';
import type { Brief } from '@shared/schemas/briefs';
import type { CandidateRecord as CandidateDto } from '@shared/schemas/runs';
import type { ReviewEvent, ReviewQueueQuery, ReviewRecord, ReviewStatus, reviewDecisionRequestSchema, reviseRequestSchema } from '@shared/schemas/reviews';
import type { FieldError, Role } from '@shared/schemas';
import {
  FROZEN_STATES,
  REVIEW_STATE_LABELS,
  nextState,
  reviewAction,
  type ReviewAction,
  type ReviewState,
} from '@shared/reviews/state-machine';
import { lineOf } from '@shared/evaluation/components';
import { verifyComposition } from '@shared/evaluation/verify';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { pageOf, pageWindow } from '../http/paging';
import { recordAudit } from '../audit/audit.service';
import { AuditEventRecord } from '../audit/audit-event.model';
import type { AuthUser } from '../auth/session-user';
import { CandidateRecord } from '../candidates/candidate.model';
import { findCandidateRow } from '../candidates/candidate-context';
import { activeCalibrations } from '../lab-logs/lab-logs.service';
import { RunRecord } from '../runs/run.model';
import { toCandidateDto, toOptimiserIngredient } from '../runs/runs.service';
import { IngredientRecord } from '../ingredients/ingredient.model';
import { workspaceChemistryLibrary } from '../species/species.service';
import { UserRecord } from '../users/user.model';
import { registerWaitingProvider } from '../home/home.service';
import { ReviewRecordModel } from './review.model';
import { notifyTransition } from './reviews.mail';

type DecisionBody = z.output<typeof reviewDecisionRequestSchema>;
type ReviseBody = z.output<typeof reviseRequestSchema>;

// The composition of a submitted candidate never changes in place: a change makes a new version.
CandidateRecord.addHook('beforeUpdate', (candidate: CandidateRecord) => {
  if (!candidate.changed('data')) return;
  const before = candidate.previous('data') as CandidateRecord['data'] | undefined;
  const wasFrozen = candidate.previous('submittedAt') != null || (FROZEN_STATES as readonly string[]).includes(String(candidate.previous('state') ?? candidate.state));
  if (wasFrozen && before && JSON.stringify(before.composition) !== JSON.stringify(candidate.data.composition)) {
    throw AppError.conflict('This candidate has been submitted for review; its composition is frozen. Revise it to make a new version.', 'composition_frozen');
  }
});

function findCandidate(workspaceId: number, id: number, transaction?: Transaction, lock = false): Promise<CandidateRecord> {
  return findCandidateRow(workspaceId, id, { ...(transaction ? { transaction } : {}), lock });
}

export async function childOf(workspaceId: number, id: number, transaction?: Transaction): Promise<CandidateRecord | null> {
  return CandidateRecord.findOne({ where: { workspaceId, parentCandidateId: id }, transaction });
}

export async function reviewStatus(c: CandidateRecord, transaction?: Transaction): Promise<ReviewStatus> {
  const [child, submitter] = await Promise.all([
    childOf(c.workspaceId, c.id, transaction),
    c.submittedById ? UserRecord.findByPk(c.submittedById, { attributes: ['name'], transaction }) : Promise.resolve(null),
  ]);
  return {
    candidateId: c.id,
    state: c.state as ReviewState,
    revision: c.revision,
    parentCandidateId: c.parentCandidateId,
    childCandidateId: child?.id ?? null,
    submittedAt: c.submittedAt ? c.submittedAt.toISOString() : null,
    submittedBy: submitter?.name ?? null,
    version: c.version,
  };
}

function transitionOrThrow(state: string, action: ReviewAction, role: Role): ReviewState {
  const result = nextState(state as ReviewState, action, role);
  if ('to' in result) return result.to;
  if (result.error === 'forbidden') throw AppError.forbidden(`Your role (${role}) cannot ${action.replace(/-/g, ' ')} a candidate.`);
  const label = REVIEW_STATE_LABELS[state as ReviewState] ?? state;
  throw AppError.conflict(`This candidate is ${label.toLowerCase()}; "${action.replace(/-/g, ' ')}" is not possible from there.`, 'illegal_transition');
}

export interface TransitionResult {
  candidate: CandidateDto;
  status: ReviewStatus;
}

/** Designer (or admin): shortlisted → in chemistry review. Freezes the composition and mails the chemists. */
export async function submitCandidate(actor: AuthUser, id: number, comment: string): Promise<TransitionResult> {
  const { candidate, from, to } = await sequelize.transaction(async (transaction) => {
    const candidate = await findCandidate(actor.workspaceId, id, transaction, true);
    const from = candidate.state;
    const to = transitionOrThrow(from, 'submit', actor.role);
    await candidate.update({ state: to, submittedAt: new Date(), submittedById: actor.id, version: candidate.version + 1 }, { transaction });
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'candidate.submit', entityType: 'candidate', entityId: id, detail: { from, to, comment, revision: candidate.revision } }, transaction);
    return { candidate, from, to };
  });
  await notifyTransition({ actor, candidate, from, to, comment, kind: 'submitted' });
  return { candidate: toCandidateDto(candidate), status: await reviewStatus(candidate) };
}

/**
 * Separation of duties: the regulatory decision on a candidate revision must come from someone
 * other than whoever made its chemistry decision — whatever role that person holds now (a chemist
 * made a reviewer keeps their chemistry decisions). Each revision is its own candidate row, so
 * "this revision" is this candidate id.
 */
async function refuseSecondSignOff(actor: AuthUser, candidate: CandidateRecord, transaction: Transaction): Promise<void> {
  const own = await ReviewRecordModel.findOne({
    where: { workspaceId: actor.workspaceId, candidateId: candidate.id, stage: 'chemistry', reviewerId: actor.id },
    order: [['createdAt', 'DESC']],
    transaction,
  });
  if (!own) return;
  throw new AppError({
    status: 403,
    code: 'separation_of_duties',
    message: `You made the chemistry decision on revision ${candidate.revision} of this candidate (${own.createdAt.toISOString().slice(0, 10)}), so its regulatory decision must come from another reviewer.`,
  });
}

/** Chemist in chemistry review, reviewer in regulatory review: approve, request changes, or reject. */
export async function decideReview(actor: AuthUser, id: number, body: DecisionBody): Promise<TransitionResult & { review: ReviewRecord }> {
  const action = reviewAction(body.stage, body.verdict);
  const { candidate, review, from, to } = await sequelize.transaction(async (transaction) => {
    const candidate = await findCandidate(actor.workspaceId, id, transaction, true);
    const from = candidate.state;
    const to = transitionOrThrow(from, action, actor.role);
    if (body.stage === 'regulatory') await refuseSecondSignOff(actor, candidate, transaction);
    const review = await ReviewRecordModel.create(
      { workspaceId: actor.workspaceId, candidateId: id, stage: body.stage, verdict: body.verdict, checklist: body.checklist as Record<string, unknown>, comment: body.comment, reviewerId: actor.id, fromState: from, toState: to },
      { transaction },
    );
    await candidate.update({ state: to, version: candidate.version + 1 }, { transaction });
    await recordAudit(
      { workspaceId: actor.workspaceId, actorId: actor.id, action: 'candidate.review', entityType: 'candidate', entityId: id, detail: { from, to, stage: body.stage, verdict: body.verdict, comment: body.comment, checklist: body.checklist, reviewId: review.id } },
      transaction,
    );
    return { candidate, review, from, to };
  });
  await notifyTransition({ actor, candidate, from, to, comment: body.comment, kind: 'review', stage: body.stage, verdict: body.verdict });
  return { candidate: toCandidateDto(candidate), status: await reviewStatus(candidate), review: toReviewDto(review, { id: actor.id, name: actor.name, role: actor.role }) };
}

/**
 * Designer (or admin), after changes were requested: a new version (revision + 1, linked to its
 * parent) with the edited composition, re-evaluated by the time model against the run's brief,
 * starting shortlisted. The old version keeps its state and its history.
 */
export async function reviseCandidate(actor: AuthUser, id: number, body: ReviseBody): Promise<TransitionResult> {
  const parentProbe = await findCandidate(actor.workspaceId, id);
  transitionOrThrow(parentProbe.state, 'revise', actor.role);

  const ids = [...new Set(body.composition.map((c) => c.ingredientId))];
  const [ingredients, lib, run, calibrations] = await Promise.all([
    IngredientRecord.findAll({ where: { workspaceId: actor.workspaceId, id: { [Op.in]: ids } } }),
    workspaceChemistryLibrary(actor.workspaceId),
    RunRecord.findByPk(parentProbe.runId, { attributes: ['id', 'briefSnapshot'] }),
    activeCalibrations(actor.workspaceId),
  ]);
  const byId = new Map(ingredients.map((i) => [i.id, i]));
  const fields: FieldError[] = [];
  body.composition.forEach((c, k) => {
    if (!byId.has(c.ingredientId)) fields.push({ field: `composition.${k}.ingredientId`, message: `no ingredient ${c.ingredientId} in this workspace's library` });
  });
  if (body.composition.filter((c) => c.ingredientId && c.massG > 0).length === 0) fields.push({ field: 'composition', message: 'give at least one ingredient with a mass above 0 g' });
  if (new Set(body.composition.map((c) => c.ingredientId)).size !== body.composition.length) fields.push({ field: 'composition', message: 'list each ingredient once' });
  if (fields.length) throw AppError.validation(`Invalid composition: ${fields.map((f) => `${f.field} ${f.message}`).join('; ')}`, fields);

  const brief = run!.briefSnapshot as Brief;
  const lines = body.composition.filter((c) => c.massG > 0).map((c) => ({ record: byId.get(c.ingredientId)!, massG: c.massG }));
  // The edited composition is checked against today's library and today's calibrations (the run's may be stale).
  const verification = verifyComposition(lib, brief, lines.map((l) => lineOf(toOptimiserIngredient(l.record), l.massG)), { calibrations });
  const { profile: _profile, evaluation: _evaluation, ...verificationOnly } = verification;
  // In the order of the parent's set, so the names keep their order; new actives follow.
  const order = (id: number) => {
    const k = parentProbe.data.setIds.indexOf(String(id));
    return k < 0 ? Number.MAX_SAFE_INTEGER : k;
  };
  const actives = lines.filter((l) => l.record.role === 'active').sort((a, b) => order(a.record.id) - order(b.record.id) || a.record.id - b.record.id);
  const fillMassG = lines.reduce((a, l) => a + l.massG, 0);
  const cost = lines.reduce((a, l) => a + (Number(l.record.costPerKg) * l.massG) / 1000, 0) + Number(brief.packaging.cost);
  const label = (r: IngredientRecord) => (r.grade ? `${r.name} (${r.grade})` : r.name);

  const { child, parent, from } = await sequelize.transaction(async (transaction) => {
    const parent = await findCandidate(actor.workspaceId, id, transaction, true);
    const from = parent.state;
    const to = transitionOrThrow(from, 'revise', actor.role);
    if (await childOf(actor.workspaceId, id, transaction)) throw AppError.conflict('This version has already been revised; revise the newest version.', 'already_revised');
    const data: CandidateRecord['data'] = {
      ...parent.data,
      setIds: actives.map((l) => String(l.record.id)),
      setNames: actives.map((l) => label(l.record)),
      composition: lines.map((l) => ({ ingredientId: String(l.record.id), name: label(l.record), role: l.record.role, massG: l.massG })),
      fillMassG,
      massG: fillMassG + brief.packaging.massG,
      unitCost: cost.toFixed(4),
      unitCostValue: cost,
      predictedMinTempC: verification.minTempC,
      predictedMaxTempC: verification.maxTempC,
      minutesInBand: verification.minutesInBand,
      verification: verificationOnly,
      pareto: false,
      sensitivity: [],
      warnings: [
        ...parent.data.warnings.filter((w) => w.code !== 'revised-composition'),
        {
          code: 'revised-composition',
          message: `Revision ${parent.revision + 1} of candidate ${parent.id}: the composition was edited after review and re-checked with the time model; the linear-model figures (heat surplus, adiabatic extreme, sensitivities) are those of the optimiser's original answer.`,
        },
      ],
    };
    const created = await CandidateRecord.create(
      {
        workspaceId: actor.workspaceId,
        runId: parent.runId,
        briefId: parent.briefId,
        setKey: data.setIds.join('+'),
        rank: parent.rank,
        pareto: false,
        verificationStatus: verification.status,
        state: to,
        data,
        parentCandidateId: parent.id,
        revision: parent.revision + 1,
      },
      { transaction },
    );
    await recordAudit(
      { workspaceId: actor.workspaceId, actorId: actor.id, action: 'candidate.revise', entityType: 'candidate', entityId: parent.id, detail: { from, to, comment: body.comment, newCandidateId: created.id, before: parent.data.composition, after: data.composition } },
      transaction,
    );
    await recordAudit(
      { workspaceId: actor.workspaceId, actorId: actor.id, action: 'candidate.create-revision', entityType: 'candidate', entityId: created.id, detail: { parentCandidateId: parent.id, revision: created.revision, to } },
      transaction,
    );
    return { child: created, parent, from };
  }).catch((error: unknown) => {
    // Two revisions of one version raced: the unique parent index lets one through.
    if (error instanceof UniqueConstraintError) throw AppError.conflict('This version has already been revised; revise the newest version.', 'already_revised');
    throw error;
  });
  await notifyTransition({ actor, candidate: parent, from, to: 'shortlisted', comment: body.comment, kind: 'revised', newCandidateId: child.id });
  return { candidate: toCandidateDto(child), status: await reviewStatus(child) };
}

export function toReviewDto(r: ReviewRecordModel, reviewer?: { id: number; name: string; role: string } | null): ReviewRecord {
  const who = reviewer ?? (r.reviewer ? { id: r.reviewer.id, name: r.reviewer.name, role: r.reviewer.role } : null);
  return {
    id: r.id,
    candidateId: r.candidateId,
    stage: r.stage,
    verdict: r.verdict,
    checklist: r.checklist,
    comment: r.comment,
    reviewer: who ?? { id: null, name: 'a former member', role: '' },
    fromState: r.fromState,
    toState: r.toState,
    createdAt: r.createdAt.toISOString(),
  };
}

/** The chain of versions ending at this candidate, oldest first. */
async function lineage(c: CandidateRecord): Promise<CandidateRecord[]> {
  const chain = [c];
  let cursor = c;
  while (cursor.parentCandidateId && chain.length < 50) {
    const parent = await CandidateRecord.findOne({ where: { id: cursor.parentCandidateId, workspaceId: c.workspaceId } });
    if (!parent) break;
    chain.unshift(parent);
    cursor = parent;
  }
  return chain;
}

/** Reviews of this candidate and its earlier versions, and the timeline of submissions, decisions and revisions. */
export async function reviewHistory(workspaceId: number, id: number): Promise<{ status: ReviewStatus; reviews: ReviewRecord[]; events: ReviewEvent[] }> {
  const candidate = await findCandidate(workspaceId, id);
  const chain = await lineage(candidate);
  const ids = chain.map((c) => c.id);
  const revisionOf = new Map(chain.map((c) => [c.id, c.revision]));
  const [reviews, audits] = await Promise.all([
    ReviewRecordModel.findAll({ where: { workspaceId, candidateId: { [Op.in]: ids } }, include: [{ model: UserRecord, as: 'reviewer', attributes: ['id', 'name', 'role'] }], order: [['createdAt', 'ASC'], ['id', 'ASC']] }),
    AuditEventRecord.findAll({ where: { workspaceId, entityType: 'candidate', entityId: { [Op.in]: ids.map(String) }, action: { [Op.in]: ['candidate.submit', 'candidate.revise'] } }, order: [['createdAt', 'ASC'], ['id', 'ASC']] }),
  ]);
  const actorIds = [...new Set(audits.map((a) => a.actorId).filter((x): x is number => x != null))];
  const actors = new Map((await UserRecord.findAll({ where: { id: { [Op.in]: actorIds } }, attributes: ['id', 'name', 'role'] })).map((u) => [u.id, u]));
  const reviewDtos = reviews.map((r) => toReviewDto(r));
  const events: ReviewEvent[] = [
    ...audits.map((a): ReviewEvent => {
      const detail = a.detail as { from?: string; to?: string; comment?: string; newCandidateId?: number };
      const who = a.actorId ? actors.get(a.actorId) : undefined;
      const cid = Number(a.entityId);
      return {
        kind: a.action === 'candidate.submit' ? 'submitted' : 'revised',
        at: a.createdAt.toISOString(),
        actor: who?.name ?? 'a former member',
        actorRole: who?.role ?? '',
        candidateId: cid,
        revision: revisionOf.get(cid) ?? 1,
        from: detail.from ?? '',
        to: detail.to ?? '',
        comment: detail.comment ?? '',
        review: null,
        newCandidateId: detail.newCandidateId ?? null,
      };
    }),
    ...reviewDtos.map((r): ReviewEvent => ({
      kind: 'review',
      at: r.createdAt,
      actor: r.reviewer.name,
      actorRole: r.reviewer.role,
      candidateId: r.candidateId,
      revision: revisionOf.get(r.candidateId) ?? 1,
      from: r.fromState,
      to: r.toState,
      comment: r.comment,
      review: r,
      newCandidateId: null,
    })),
  ].sort((a, b) => a.at.localeCompare(b.at));
  return { status: await reviewStatus(candidate), reviews: reviewDtos, events };
}

interface QueueRow {
  id: number;
  state: ReviewState;
  revision: number;
  brief_id: number;
  brief_name: string | null;
  set_names: string[] | null;
  updated_at: Date;
  total: string;
}

/**
 * A page of the workspace's candidates in these states, most recently changed first, in one query:
 * the brief's name as the run froze it, and no candidate sent back for changes that was already
 * revised (its revision carries on in the queue).
 */
async function queueFor(workspaceId: number, states: ReviewState[], page: { page: number; pageSize: number; sort?: string } = { page: 1, pageSize: 100 }) {
  const direction = page.sort === 'updatedAt' ? 'ASC' : 'DESC';
  const replacements = { workspaceId, states, ...pageWindow(page) };
  const where = `c.workspace_id = :workspaceId AND c.state IN (:states)
      AND NOT (c.state = 'changes-requested' AND EXISTS (SELECT 1 FROM candidates k WHERE k.workspace_id = c.workspace_id AND k.parent_candidate_id = c.id))`;
  const rows = await sequelize.query<QueueRow>(
    `SELECT c.id, c.state, c.revision, c.brief_id, r.brief_snapshot->>'name' AS brief_name, c.data->'setNames' AS set_names, c.updated_at,
            count(*) OVER () AS total
       FROM candidates c
       LEFT JOIN runs r ON r.id = c.run_id AND r.workspace_id = c.workspace_id
      WHERE ${where}
      ORDER BY c.updated_at ${direction}, c.id ${direction}
      LIMIT :limit OFFSET :offset`,
    { replacements, type: QueryTypes.SELECT },
  );
  let total = rows[0] ? Number(rows[0].total) : 0;
  if (rows.length === 0 && page.page > 1) {
    const [counted] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM candidates c WHERE ${where}`, { replacements, type: QueryTypes.SELECT });
    total = Number(counted?.n ?? 0);
  }
  const items = rows.map((r) => ({
    candidateId: r.id,
    state: r.state,
    revision: r.revision,
    briefId: r.brief_id,
    briefName: r.brief_name ?? `Brief ${r.brief_id}`,
    setNames: r.set_names ?? [],
    updatedAt: r.updated_at.toISOString(),
  }));
  return pageOf(page, items, total);
}

/** The states a role acts on. */
export function statesWaitingOn(role: Role): ReviewState[] {
  if (role === 'chemist') return ['in-chemistry-review'];
  if (role === 'reviewer') return ['in-regulatory-review'];
  return ['changes-requested', 'shortlisted'];
}

/** What waits for the signed-in member's role, and what is in review for everyone to follow. */
export async function reviewQueue(user: AuthUser, query: ReviewQueueQuery) {
  const states: ReviewState[] = query.queue === 'waiting' ? statesWaitingOn(user.role) : ['in-chemistry-review', 'in-regulatory-review', 'approved', 'changes-requested', 'rejected'];
  return { role: user.role, queue: query.queue, ...(await queueFor(user.workspaceId, states, query)) };
}

registerWaitingProvider(['chemist'], async (user) => {
  const { items, total } = await queueFor(user.workspaceId, ['in-chemistry-review']);
  return {
    items: items.map((i) => ({ kind: 'chemistry-review', title: `Chemistry review: ${i.setNames.join(' + ')} (revision ${i.revision})`, detail: `For the brief “${i.briefName}”.`, href: `/candidates/${i.candidateId}` })),
    counts: { inChemistryReview: total },
  };
});
registerWaitingProvider(['reviewer'], async (user) => {
  const { items, total } = await queueFor(user.workspaceId, ['in-regulatory-review']);
  return {
    items: items.map((i) => ({ kind: 'regulatory-review', title: `Regulatory review: ${i.setNames.join(' + ')} (revision ${i.revision})`, detail: `For the brief “${i.briefName}”; chemistry approved.`, href: `/candidates/${i.candidateId}` })),
    counts: { inRegulatoryReview: total },
  };
});
registerWaitingProvider(['designer'], async (user) => {
  const { items, total } = await queueFor(user.workspaceId, ['changes-requested']);
  return {
    items: items.map((i) => ({ kind: 'changes-requested', title: `Changes requested: ${i.setNames.join(' + ')} (revision ${i.revision})`, detail: `For the brief “${i.briefName}”; revise it and submit again.`, href: `/candidates/${i.candidateId}` })),
    counts: { changesRequested: total },
  };
});

export { findCandidate, lineage };
