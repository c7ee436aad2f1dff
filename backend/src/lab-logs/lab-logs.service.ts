import { createHash } from 'node:crypto';
import type { ChemistryLibrary } from '@shared/chemistry/types';
import {
  briefScenario,
  calibrateToLog,
  DEFAULT_SPREADS,
  mapColumns,
  meetsBrief,
  monteCarloBand,
  overlayCurves,
  previewLog,
  simulateScenario,
  SPREAD_BASIS,
  contactUaMultiplier,
  thin,
  type LabScenario,
  type LogPreview,
  type ModelCalibrations,
  type RowError,
} from '@shared/lab-logs';
import type { ApplyCalibrationRequest, CalibrationListQuery, CreateLabLogRequest, LabLogListQuery } from '@shared/schemas/lab-logs';
import type { Paged } from '@shared/schemas';
import { chemistryModelFor } from '@shared/evaluation/chemistry-cache';
import { componentsOf, lineOf } from '@shared/evaluation/components';
import { holdBand } from '@shared/evaluation/verify';
import { packAreaM2, processForFormula, type ChemistryPort, type ThermalComponent } from '@shared/thermal';
import type { Brief, Candidate } from '@shared/schemas/briefs';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { pageOf, pageWindow, sortColumn } from '../http/paging';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { CandidateRecord } from '../candidates/candidate.model';
import { loadCandidateContext } from '../candidates/candidate-context';
import { toOptimiserIngredient } from '../runs/runs.service';
import { IngredientRecord } from '../ingredients/ingredient.model';
import { workspaceChemistryLibrary } from '../species/species.service';
import { UserRecord } from '../users/user.model';
import { CalibrationRecord, type CalibrationParameters } from './calibration.model';
import { LabLogRecord } from './lab-log.model';

/** Largest lab-log upload, bytes (a 50,000-row, 4-channel logger export is about 2.5 MB). */
export const LAB_LOG_MAX_BYTES = 4 * 1024 * 1024;
/** Monte Carlo samples per candidate. */
export const CONFIDENCE_SAMPLES = 200;

// ---- chemistry: the one cache of the chemistry model per library revision (evaluation/chemistry-cache.ts)
async function workspacePort(workspaceId: number): Promise<{ port: ChemistryPort; lib: ChemistryLibrary }> {
  const lib = await workspaceChemistryLibrary(workspaceId);
  return { port: chemistryModelFor(lib), lib };
}

// ---- preview ---------------------------------------------------------------------------------

export interface PreviewDto extends Omit<LogPreview, 'rows'> {
  filename: string;
  sizeBytes: number;
}

export function previewLabLog(file: { originalname: string; size: number }, text: string): PreviewDto {
  const { rows: _rows, ...rest } = previewLog(text);
  void _rows;
  return { ...rest, filename: file.originalname, sizeBytes: file.size };
}

function rowErrorsToApp(message: string, errors: RowError[], more = 0): AppError {
  return new AppError({
    status: 400,
    code: 'invalid_lab_log',
    message: `${message}${more ? ` (and ${more} more row errors)` : ''}`,
    fields: errors.map((e) => ({ field: `row ${e.row}${e.column ? ` · ${e.column}` : ''}`, message: e.message })),
  });
}

// ---- the mixture behind a log ----------------------------------------------------------------

async function scenarioFor(actor: AuthUser, meta: CreateLabLogRequest, lib: ChemistryLibrary, firstTempC: number, horizonMin: number): Promise<LabScenario> {
  const c = meta.conditions;
  let components: ThermalComponent[];
  let packHeatCapacityJPerK = 24;
  let briefArea: number | null = null;
  if (meta.candidateId !== undefined) {
    const ctx = await loadCandidateContext(actor.workspaceId, meta.candidateId);
    components = componentsOf(ctx.lines);
    const brief = ctx.brief;
    packHeatCapacityJPerK = brief.packaging.heatCapacityJPerK;
    briefArea = brief.packAreaM2;
  } else {
    const ids = meta.components!.flatMap((x) => (x.ingredientId === undefined ? [] : [x.ingredientId]));
    const rows = ids.length ? await IngredientRecord.findAll({ where: { workspaceId: actor.workspaceId, id: ids } }) : [];
    const byId = new Map(rows.map((r) => [r.id, r]));
    const fields: { field: string; message: string }[] = [];
    components = [];
    meta.components!.forEach((x, k) => {
      if (x.ingredientId !== undefined) {
        const r = byId.get(x.ingredientId);
        if (!r) return fields.push({ field: `components.${k}.ingredientId`, message: 'is not an ingredient of this workspace' });
        components.push(...componentsOf([lineOf(toOptimiserIngredient(r), x.massG)]));
      } else {
        try {
          components.push({ key: x.formula!, formula: x.formula!, massG: x.massG, process: processForFormula(lib, x.formula!) });
        } catch (e) {
          fields.push({ field: `components.${k}.formula`, message: (e as Error).message });
        }
      }
      return undefined;
    });
    if (fields.length) throw AppError.validation('Some components cannot be modelled.', fields);
  }
  const fillMassG = components.reduce((a, x) => a + x.massG, 0);
  const area = c.packAreaM2 ?? (c.packMassG ? packAreaM2({ massG: c.packMassG }) : briefArea ?? packAreaM2({ massG: fillMassG }));
  return {
    components,
    initialTempC: c.initialTempC ?? firstTempC,
    ambientC: c.ambientC,
    contact: c.contact,
    packAreaM2: area,
    uaWPerK: null,
    packHeatCapacityJPerK,
    horizonMin,
  };
}

// ---- create, list, read ----------------------------------------------------------------------

export interface LabLogSummary {
  id: number;
  name: string;
  candidateId: number | null;
  filename: string;
  sizeBytes: number;
  sampleCount: number;
  channels: string[];
  conditions: CreateLabLogRequest['conditions'];
  fitted: boolean;
  rmseK: number | null;
  createdBy: string;
  createdAt: string;
}

function toSummary(r: LabLogRecord & { createdBy?: UserRecord | null }): LabLogSummary {
  return {
    id: r.id,
    name: r.name,
    candidateId: r.candidateId,
    filename: r.filename,
    sizeBytes: r.sizeBytes,
    sampleCount: r.sampleCount,
    channels: r.channels,
    conditions: r.conditions,
    fitted: r.fit !== null,
    rmseK: r.fit ? r.fit.rmseK : null,
    createdBy: r.createdBy?.name ?? '',
    createdAt: r.createdAt.toISOString(),
  };
}

/**
 * Parses, maps and stores a lab log in one transaction with its audit event. Any row error
 * answers 400 with the rows named and nothing stored.
 */
export async function createLabLog(actor: AuthUser, file: { originalname: string; size: number; buffer: Buffer }, text: string, meta: CreateLabLogRequest): Promise<LabLogSummary> {
  const preview = previewLog(text);
  if (preview.errors.length) throw rowErrorsToApp('The file cannot be read as a lab log.', preview.errors);
  const mapped = mapColumns(preview, meta.mapping);
  if (mapped.errors.length) throw rowErrorsToApp(`${mapped.errors.length + mapped.moreErrors} row(s) cannot be read; nothing was stored. Fix them and upload again.`, mapped.errors, mapped.moreErrors);
  const channel = meta.conditions.channel;
  if (channel >= mapped.channels.length) throw AppError.validation('The compared channel is not among the mapped columns.', [{ field: 'conditions.channel', message: `must be 0 to ${mapped.channels.length - 1}` }]);
  const { lib } = await workspacePort(actor.workspaceId);
  const horizonMin = mapped.samples.at(-1)!.tSec / 60;
  const scenario = await scenarioFor(actor, meta, lib, mapped.samples[0]!.tempsC[channel]!, horizonMin);
  const sha256 = createHash('sha256').update(file.buffer).digest('hex');
  const created = await sequelize.transaction(async (transaction) => {
    const r = await LabLogRecord.create(
      {
        workspaceId: actor.workspaceId,
        candidateId: meta.candidateId ?? null,
        name: meta.name,
        notes: meta.notes ?? null,
        filename: file.originalname.slice(0, 255),
        sizeBytes: file.size,
        sha256,
        delimiter: preview.delimiter,
        headerRow: preview.headerRow,
        preamble: preview.preamble.slice(0, 20),
        startedAtText: mapped.startedAt,
        mapping: meta.mapping,
        channels: mapped.channels,
        conditions: meta.conditions,
        scenario,
        samples: mapped.samples.map((s) => [round(s.tSec, 3), ...s.tempsC.map((t) => round(t, 4))]),
        sampleCount: mapped.samples.length,
        createdById: actor.id,
      },
      { transaction },
    );
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'lab-log.create', entityType: 'lab-log', entityId: r.id, detail: { name: r.name, filename: r.filename, sha256, samples: r.sampleCount, candidateId: r.candidateId } }, transaction);
    return r;
  });
  return toSummary(Object.assign(created, { createdBy: null }));
}

export async function listLabLogs(workspaceId: number, query: LabLogListQuery): Promise<Paged<LabLogSummary>> {
  const { column, direction } = sortColumn(query.sort, { createdAt: 'createdAt', name: 'name' });
  const { rows, count } = await LabLogRecord.findAndCountAll({
    where: { workspaceId, ...(query.candidateId !== undefined ? { candidateId: query.candidateId } : {}) },
    attributes: { exclude: ['samples', 'scenario'] },
    include: [{ model: UserRecord, as: 'createdBy', attributes: ['name'] }],
    order: [[column, direction], ['id', direction]],
    ...pageWindow(query),
    distinct: true,
  });
  return pageOf(query, rows.map((r) => toSummary(r as LabLogRecord & { createdBy?: UserRecord | null })), count);
}

async function findLog(workspaceId: number, id: number): Promise<LabLogRecord> {
  const r = await LabLogRecord.findOne({ where: { id, workspaceId }, include: [{ model: UserRecord, as: 'createdBy', attributes: ['name'] }] });
  if (!r) throw AppError.notFound('Lab log');
  return r;
}

function measuredOf(r: LabLogRecord): { tSec: number; tempC: number }[] {
  const ch = r.conditions.channel ?? 0;
  return r.samples.map((s) => ({ tSec: s[0]!, tempC: s[1 + ch]! }));
}

/** One lab log: its samples, the nominal prediction over them, the fitted one when fitted, RMSE and minutes in band. */
export async function getLabLog(workspaceId: number, id: number) {
  const r = await findLog(workspaceId, id);
  const { port } = await workspacePort(workspaceId);
  const measured = measuredOf(r);
  const scenario = r.scenario;
  let band: { minC: number; maxC: number } | null = null;
  let brief: Brief | null = null;
  if (r.candidateId !== null) {
    const ctx = await loadCandidateContext(workspaceId, r.candidateId).catch(() => null);
    if (ctx) {
      brief = ctx.brief;
      band = holdBand(brief);
    }
  }
  let predictedCurve: { tMin: number; tempC: number }[] = [];
  let modelError: string | null = null;
  try {
    predictedCurve = simulateScenario(port, scenario, undefined, { curveStepMin: Math.max(0.02, scenario.horizonMin / 400) }).curve;
  } catch (e) {
    modelError = (e as Error).message;
  }
  const overlay = overlayCurves(measured, predictedCurve, band);
  let fitted: { curve: { tMin: number; tempC: number }[]; overlay: ReturnType<typeof overlayCurves> } | null = null;
  if (r.fit && !modelError) {
    const curve = simulateScenario(port, scenario, { uaMultiplier: r.fit.uaMultiplier.value, enthalpyFactor: r.fit.enthalpyFactor.value, rateMultiplier: r.fit.rateMultiplier.value, heatCapacityFactor: 1 }, { curveStepMin: Math.max(0.02, scenario.horizonMin / 400) }).curve;
    const o = overlayCurves(measured, curve, band);
    fitted = { curve: thin(curve, 400), overlay: { ...o, points: thin(o.points, 600) } };
  }
  return {
    labLog: {
      ...toSummary(r as LabLogRecord & { createdBy?: UserRecord | null }),
      sha256: r.sha256,
      delimiter: r.delimiter,
      headerRow: r.headerRow,
      preamble: r.preamble,
      startedAt: r.startedAtText,
      mapping: r.mapping,
      notes: r.notes,
      scenario: { ...scenario, components: scenario.components.map((c) => ({ key: c.key ?? c.formula ?? '', massG: c.massG, kind: c.process.kind })) },
      fit: r.fit,
    },
    samples: thin(r.samples, 2000),
    band,
    briefName: brief?.name ?? null,
    predicted: { curve: thin(predictedCurve, 400), overlay: { ...overlay, points: thin(overlay.points, 600) }, error: modelError },
    fitted,
  };
}

/** Fits the log (calibrate.ts), stores the fit with who and how long, audits it. */
export async function fitLabLog(actor: AuthUser, id: number, fit: ('ua' | 'enthalpy' | 'rate')[]) {
  const r = await findLog(actor.workspaceId, id);
  const { port } = await workspacePort(actor.workspaceId);
  const started = performance.now();
  let result;
  try {
    result = calibrateToLog(port, r.scenario, measuredOf(r), { fit });
  } catch (e) {
    throw AppError.validation(`The model cannot be fitted to this log: ${(e as Error).message}`, [{ field: 'fit', message: (e as Error).message }]);
  }
  const stored = { ...result, elapsedMs: Math.round(performance.now() - started), fittedBy: actor.name };
  await sequelize.transaction(async (transaction) => {
    await r.update({ fit: stored, fittedAt: new Date() }, { transaction });
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'lab-log.fit', entityType: 'lab-log', entityId: r.id, detail: { fitted: fit, rmseK: result.rmseK, uaMultiplier: result.uaMultiplier.value, enthalpyFactor: result.enthalpyFactor.value, rateConstantPerMin: result.rateConstantPerMin?.value ?? null } }, transaction);
  });
  return { fit: stored };
}

// ---- calibrations ----------------------------------------------------------------------------

export interface CalibrationDto {
  id: number;
  scope: 'contact' | 'ingredient';
  contactCase: string | null;
  ingredientId: number | null;
  ingredientName: string | null;
  parameters: CalibrationParameters;
  labLogId: number | null;
  note: string | null;
  active: boolean;
  appliedBy: string;
  createdAt: string;
}

function toCalibrationDto(c: CalibrationRecord & { appliedBy?: UserRecord | null; ingredient?: IngredientRecord | null }): CalibrationDto {
  return {
    id: c.id,
    scope: c.scope,
    contactCase: c.contactCase,
    ingredientId: c.ingredientId,
    ingredientName: c.ingredient?.name ?? null,
    parameters: c.parameters,
    labLogId: c.labLogId,
    note: c.note,
    active: c.active,
    appliedBy: c.appliedBy?.name ?? '',
    createdAt: c.createdAt.toISOString(),
  };
}

/**
 * Applies a stored fit: to a contact case (its UA multiplier) or to an ingredient (its rate
 * constant and enthalpy factor, those that were fitted). The previous active calibration of the
 * same target is retired in the same transaction; both changes are audited.
 */
export async function applyCalibration(actor: AuthUser, body: ApplyCalibrationRequest): Promise<CalibrationDto> {
  const log = await findLog(actor.workspaceId, body.labLogId);
  const fit = log.fit;
  if (!fit) throw AppError.validation('Fit the lab log before applying it.', [{ field: 'labLogId', message: 'has no fit yet' }]);
  let parameters: CalibrationParameters;
  let contactCase: string | null = null;
  let ingredientId: number | null = null;
  if (body.scope === 'contact') {
    if (!fit.fitted.includes('ua')) throw AppError.validation('This fit did not fit UA.', [{ field: 'scope', message: 'the fit holds no UA multiplier' }]);
    contactCase = body.contact ?? log.conditions.contact;
    parameters = { uaMultiplier: fit.uaMultiplier.value, standardErrors: { uaMultiplier: fit.uaMultiplier.standardError }, rmseK: fit.rmseK };
  } else {
    const ing = await IngredientRecord.findOne({ where: { id: body.ingredientId!, workspaceId: actor.workspaceId } });
    if (!ing) throw AppError.notFound('Ingredient');
    if (!ing.process || ing.process.kind === 'inert') throw AppError.validation('Only an ingredient with a heat-producing process can take a kinetics calibration.', [{ field: 'ingredientId', message: 'has no process with a rate constant' }]);
    if (!log.scenario.components.some((c) => c.key === String(ing.id))) {
      throw AppError.validation('This ingredient is not in the mixture the log recorded.', [{ field: 'ingredientId', message: 'is not a component of the logged mixture' }]);
    }
    ingredientId = ing.id;
    parameters = { standardErrors: {}, rmseK: fit.rmseK };
    if (fit.fitted.includes('rate') && fit.rateConstantPerMin) {
      parameters.rateConstantPerMin = fit.rateConstantPerMin.value;
      parameters.standardErrors!.rateConstantPerMin = fit.rateConstantPerMin.standardError;
    }
    if (fit.fitted.includes('enthalpy') && ing.process.kind === 'dissolution') {
      parameters.enthalpyFactor = fit.enthalpyFactor.value;
      parameters.standardErrors!.enthalpyFactor = fit.enthalpyFactor.standardError;
    }
    if (parameters.rateConstantPerMin === undefined && parameters.enthalpyFactor === undefined) {
      throw AppError.validation('This fit holds nothing that applies to the ingredient.', [{ field: 'scope', message: 'fit the rate or the enthalpy factor first' }]);
    }
  }
  const created = await sequelize.transaction(async (transaction) => {
    const previous = await CalibrationRecord.findOne({ where: { workspaceId: actor.workspaceId, scope: body.scope, contactCase, ingredientId, active: true }, transaction, lock: transaction.LOCK.UPDATE });
    if (previous) {
      await previous.update({ active: false }, { transaction });
      await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'calibration.retire', entityType: 'calibration', entityId: previous.id, detail: { before: previous.parameters } }, transaction);
    }
    const c = await CalibrationRecord.create({ workspaceId: actor.workspaceId, scope: body.scope, contactCase, ingredientId, parameters, labLogId: log.id, note: body.note ?? null, appliedById: actor.id }, { transaction });
    await recordAudit(
      { workspaceId: actor.workspaceId, actorId: actor.id, action: 'calibration.apply', entityType: 'calibration', entityId: c.id, detail: { scope: body.scope, contactCase, ingredientId, labLogId: log.id, before: previous?.parameters ?? null, after: parameters } },
      transaction,
    );
    return c;
  });
  const full = await CalibrationRecord.findByPk(created.id, { include: [{ model: UserRecord, as: 'appliedBy', attributes: ['name'] }, { model: IngredientRecord, as: 'ingredient', attributes: ['name'] }] });
  return toCalibrationDto(full as CalibrationRecord & { appliedBy?: UserRecord | null; ingredient?: IngredientRecord | null });
}

export async function listCalibrations(workspaceId: number, query: CalibrationListQuery): Promise<Paged<CalibrationDto>> {
  const direction = query.sort === 'createdAt' ? 'ASC' : 'DESC';
  const { rows, count } = await CalibrationRecord.findAndCountAll({
    where: { workspaceId, ...(query.active !== undefined ? { active: query.active } : {}) },
    include: [{ model: UserRecord, as: 'appliedBy', attributes: ['name'] }, { model: IngredientRecord, as: 'ingredient', attributes: ['name'] }],
    order: [['createdAt', direction], ['id', direction]],
    ...pageWindow(query),
    distinct: true,
  });
  return pageOf(query, rows.map((r) => toCalibrationDto(r as CalibrationRecord & { appliedBy?: UserRecord | null; ingredient?: IngredientRecord | null })), count);
}

/** The workspace's active calibrations as the optimiser reads them (recorded in each run's data snapshot). */
export async function activeCalibrations(workspaceId: number): Promise<ModelCalibrations> {
  const rows = await CalibrationRecord.findAll({ where: { workspaceId, active: true }, order: [['id', 'ASC']] });
  const out: ModelCalibrations = {};
  for (const r of rows) {
    if (r.scope === 'contact' && r.contactCase && r.parameters.uaMultiplier !== undefined) {
      out.contacts = { ...out.contacts, [r.contactCase]: { uaMultiplier: r.parameters.uaMultiplier, calibrationId: r.id } };
    } else if (r.scope === 'ingredient' && r.ingredientId !== null) {
      out.ingredients = {
        ...out.ingredients,
        [String(r.ingredientId)]: {
          ...(r.parameters.rateConstantPerMin !== undefined ? { rateConstantPerMin: r.parameters.rateConstantPerMin } : {}),
          ...(r.parameters.enthalpyFactor !== undefined ? { enthalpyFactor: r.parameters.enthalpyFactor } : {}),
          calibrationId: r.id,
        },
      };
    }
  }
  return out;
}

// ---- confidence of a candidate ---------------------------------------------------------------

export interface ConfidenceDto {
  band: { tMin: number; p5: number; p50: number; p95: number }[];
  nominal: { tMin: number; tempC: number }[];
  probabilityMeetsBrief: number | null;
  samples: number;
  spreads: typeof DEFAULT_SPREADS;
  spreadBasis: typeof SPREAD_BASIS;
  targetBand: { minC: number; maxC: number };
  calibrated: boolean;
  elapsedMs: number;
}

/**
 * Monte Carlo band and probability of meeting the brief for one candidate, under the data and
 * calibrations its run used; computed once and kept in the candidate's data.
 */
export async function candidateConfidence(workspaceId: number, id: number): Promise<ConfidenceDto> {
  const ctx = await loadCandidateContext(workspaceId, id);
  const cand = ctx.candidate;
  const cached = (cand.data as Candidate & { confidence?: ConfidenceDto }).confidence;
  if (cached && cached.samples > 0) return cached;
  const brief = ctx.brief;
  const calibrations = ctx.calibrations;
  // The run's calibrations go through the evaluation core with the scenario.
  const port = chemistryModelFor(ctx.chemistry);
  const uaMultiplier = contactUaMultiplier(calibrations, brief.contact, brief.uaWPerK !== null && brief.uaWPerK !== undefined);
  const scenario = briefScenario(brief, componentsOf(ctx.lines), calibrations);
  const started = performance.now();
  let mc;
  try {
    mc = monteCarloBand(port, scenario, { samples: CONFIDENCE_SAMPLES, meets: (p) => meetsBrief(brief, p) });
  } catch (e) {
    throw AppError.validation(`The time model cannot run this candidate: ${(e as Error).message}`, [{ field: 'id', message: (e as Error).message }]);
  }
  const result: ConfidenceDto = {
    band: mc.band,
    nominal: mc.nominal,
    probabilityMeetsBrief: mc.probabilityMeetsBrief,
    samples: mc.samples,
    spreads: mc.spreads,
    spreadBasis: SPREAD_BASIS,
    targetBand: holdBand(brief),
    calibrated: uaMultiplier !== 1 || Object.keys(calibrations?.ingredients ?? {}).length > 0,
    elapsedMs: Math.round(performance.now() - started),
  };
  await CandidateRecord.update({ data: { ...cand.data, confidence: result } as Candidate }, { where: { id: cand.id, workspaceId } });
  return result;
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}
