import { Op } from 'sequelize';
import type { CandidateListQuery, CandidateRecord as CandidateDto } from '@shared/schemas/runs';
import type { Paged } from '@shared/schemas';
import type { Brief } from '@shared/schemas/briefs';
import type { CandidateCurve } from '@shared/schemas/runs';
import { holdBand, verifyComposition } from '@shared/evaluation/verify';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { pageOf, pageWindow, sortColumn } from '../http/paging';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { RunRecord } from '../runs/run.model';
import { toCandidateDto } from '../runs/runs.service';
import { Workspace } from '../workspaces/workspace.model';
import { CandidateRecord } from './candidate.model';
import { findCandidateRow, loadCandidateContext, type CandidateContext } from './candidate-context';

export async function getCandidate(workspaceId: number, id: number): Promise<{ candidate: CandidateDto; currency: string; brief: Brief }> {
  const candidate = await findCandidateRow(workspaceId, id);
  const [run, workspace] = await Promise.all([
    RunRecord.findOne({ where: { id: candidate.runId, workspaceId }, attributes: ['briefSnapshot'] }),
    Workspace.findByPk(workspaceId),
  ]);
  return { candidate: toCandidateDto(candidate), currency: workspace?.currency ?? 'EUR', brief: run!.briefSnapshot };
}

/**
 * A candidate's temperature curve as its run verified it: the evaluation core over the
 * verification horizon with the run's brief, data snapshot (packaging lines included) and
 * calibrations. Empty when an ingredient can no longer be found or the model cannot run it.
 */
export function candidateCurve(ctx: CandidateContext): CandidateCurve {
  const band = holdBand(ctx.brief);
  if (ctx.missing.length || !ctx.lines.some((l) => l.massG > 0)) return { curve: [], band, timeToTargetMin: null, minutesInBand: null, error: ctx.missing.length ? `ingredients ${ctx.missing.join(', ')} are no longer in the library or the run's data` : 'no ingredient above 0 g' };
  const v = verifyComposition(ctx.chemistry, ctx.brief, ctx.lines, { calibrations: ctx.calibrations });
  return {
    curve: v.profile?.curve.map((p) => ({ tMin: p.tMin, tempC: p.tempC })) ?? [],
    band,
    timeToTargetMin: v.timeToTargetMin,
    minutesInBand: v.minutesInBand,
    error: v.status === 'failed' ? (v.reasons[0] ?? 'the time model could not run this candidate') : null,
  };
}

/** GET /api/candidates/:id/curve. */
export async function getCandidateCurve(workspaceId: number, id: number): Promise<CandidateCurve> {
  return candidateCurve(await loadCandidateContext(workspaceId, id));
}

/** Several candidates of the workspace at once, for side-by-side comparison (2–4). */
export async function compareCandidates(workspaceId: number, ids: number[]): Promise<CandidateDto[]> {
  const rows = await CandidateRecord.findAll({ where: { workspaceId, id: { [Op.in]: ids } } });
  if (rows.length !== new Set(ids).size) throw AppError.notFound('Candidate');
  const byId = new Map(rows.map((r) => [r.id, r]));
  return ids.map((id) => toCandidateDto(byId.get(id)!));
}

/** Marks a proposed candidate as shortlisted (or takes it off the shortlist). */
export async function setShortlisted(actor: AuthUser, id: number, shortlisted: boolean): Promise<CandidateDto> {
  return sequelize.transaction(async (transaction) => {
    const candidate = await findCandidateRow(actor.workspaceId, id, { transaction, lock: true });
    const from = candidate.state;
    const to = shortlisted ? 'shortlisted' : 'proposed';
    if (from !== 'proposed' && from !== 'shortlisted') {
      throw AppError.conflict(`This candidate is ${from.replace(/-/g, ' ')}; its shortlist state can no longer change.`, 'candidate_locked');
    }
    if (from !== to) {
      await candidate.update({ state: to, version: candidate.version + 1 }, { transaction });
      await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: shortlisted ? 'candidate.shortlist' : 'candidate.unshortlist', entityType: 'candidate', entityId: id, detail: { from, to } }, transaction);
    }
    return toCandidateDto(candidate);
  });
}

/** A page of the workspace's candidates in one state (the shortlist unless another state is asked for). */
export async function listCandidates(workspaceId: number, query: CandidateListQuery): Promise<Paged<CandidateDto>> {
  const { column, direction } = sortColumn(query.sort, { updatedAt: 'updatedAt', rank: 'rank', createdAt: 'createdAt' });
  const { rows, count } = await CandidateRecord.findAndCountAll({
    where: { workspaceId, state: query.state, ...(query.briefId !== undefined ? { briefId: query.briefId } : {}) },
    order: [[column, direction], ['id', direction]],
    ...pageWindow(query),
  });
  return pageOf(query, rows.map(toCandidateDto), count);
}
