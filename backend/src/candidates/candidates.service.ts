import { Op } from 'sequelize';
import type { CandidateListQuery, CandidateRecord as CandidateDto } from '@shared/schemas/runs';
import type { Paged } from '@shared/schemas';
import type { Brief } from '@shared/schemas/briefs';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { pageOf, pageWindow, sortColumn } from '../http/paging';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { RunRecord } from '../runs/run.model';
import { toCandidateDto } from '../runs/runs.service';
import { Workspace } from '../workspaces/workspace.model';
import { CandidateRecord } from './candidate.model';

export async function getCandidate(workspaceId: number, id: number): Promise<{ candidate: CandidateDto; currency: string; brief: Brief }> {
  const candidate = await CandidateRecord.findOne({ where: { id, workspaceId } });
  if (!candidate) throw AppError.notFound('Candidate');
  const [run, workspace] = await Promise.all([
    RunRecord.findByPk(candidate.runId, { attributes: ['briefSnapshot'] }),
    Workspace.findByPk(workspaceId),
  ]);
  return { candidate: toCandidateDto(candidate), currency: workspace?.currency ?? 'EUR', brief: run!.briefSnapshot };
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
    const candidate = await CandidateRecord.findOne({ where: { id, workspaceId: actor.workspaceId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!candidate) throw AppError.notFound('Candidate');
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
