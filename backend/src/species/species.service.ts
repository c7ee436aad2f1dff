import { Op, literal, type Transaction, type WhereOptions } from 'sequelize';
import { createChemistryLibrary, hillFormula, molarMass, parseFormula, speciesKey } from '@shared/chemistry';
import type { ChemistryLibrary, DilutionSeries, EutecticPoint, FreezingPointSeries, Phase, SolubilitySeries, SolutionHeatCapacityCoefficients, SpeciesRecord } from '@shared/chemistry/types';
import type { CreateSpeciesRequest, Species, SpeciesListQuery, UpdateSpeciesRequest } from '@shared/schemas';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { likePattern, pageOf, pageWindow, sortColumn } from '../http/paging';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { SpeciesRow } from './species.model';
import { DilutionPointRow, EutecticRow, FreezingPointRow, SolubilityPointRow, SolutionHeatCapacityRow } from './reference-data.model';

export function toSpeciesDto(row: SpeciesRow): Species {
  return {
    id: row.id,
    key: row.key,
    formula: row.formula,
    phase: row.phase,
    name: row.name,
    dfH_kJ_per_mol: row.dfhKjPerMol,
    dfG_kJ_per_mol: row.dfgKjPerMol,
    S_J_per_mol_K: row.sJPerMolK,
    Cp_J_per_mol_K: row.cpJPerMolK,
    molarMass_g_per_mol: row.molarMassGPerMol,
    source: row.source,
    scope: row.workspaceId === null ? 'reference' : 'workspace',
    correctsId: row.correctsId ?? null,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
  };
}

function toRecord(row: SpeciesRow): SpeciesRecord {
  return {
    key: row.key,
    formula: row.formula,
    phase: row.phase,
    name: row.name,
    dfH_kJ_per_mol: row.dfhKjPerMol,
    dfG_kJ_per_mol: row.dfgKjPerMol,
    S_J_per_mol_K: row.sJPerMolK,
    Cp_J_per_mol_K: row.cpJPerMolK,
    molarMass_g_per_mol: row.molarMassGPerMol,
    source: row.source,
  };
}

/** What a workspace sees: the reference rows it has not corrected, and its own rows. */
function visibleTo(workspaceId: number): WhereOptions {
  const id = Number(workspaceId);
  return {
    [Op.or]: [
      { workspaceId: id },
      { workspaceId: null, key: { [Op.notIn]: literal(`(SELECT s2.key FROM species s2 WHERE s2.workspace_id = ${id})`) } },
    ],
  };
}

export async function listSpecies(workspaceId: number, query: SpeciesListQuery) {
  const and: WhereOptions[] = [visibleTo(workspaceId)];
  if (query.q) {
    const p = likePattern(query.q);
    and.push({ [Op.or]: [{ formula: { [Op.iLike]: p } }, { name: { [Op.iLike]: p } }, { key: { [Op.iLike]: p } }] });
  }
  if (query.phase) and.push({ phase: query.phase });
  if (query.scope === 'reference') and.push({ workspaceId: null });
  if (query.scope === 'workspace') and.push({ workspaceId: { [Op.ne]: null } });
  const { column, direction } = sortColumn(query.sort, { formula: 'formula', name: 'name', phase: 'phase', updatedAt: 'updatedAt' });
  const { rows, count } = await SpeciesRow.findAndCountAll({
    where: { [Op.and]: and },
    order: [[column, direction], ['formula', 'ASC'], ['phase', 'ASC'], ['id', 'ASC']],
    ...pageWindow(query),
  });
  return pageOf(query, rows.map(toSpeciesDto), count);
}

/** The formula as stored: phase tag removed, hydrate separators written as `·`, charge kept. */
function normaliseFormula(formula: string): string {
  return formula
    .trim()
    .replace(/\(\s*(cr|s|c|l|g|aq|ai|ao)\s*\)\s*$/, '')
    .trim()
    .replace(/\s*[.*•∙⋅]\s*/g, '·');
}

export async function getSpeciesRow(workspaceId: number, id: number, transaction?: Transaction): Promise<SpeciesRow> {
  const row = await SpeciesRow.findOne({ where: { id, [Op.or]: [{ workspaceId }, { workspaceId: null }] }, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!row) throw AppError.notFound('Species');
  return row;
}

/** Adds a species to the workspace's data, with its citation; audited. */
export async function createSpecies(actor: AuthUser, input: CreateSpeciesRequest): Promise<Species> {
  const formula = normaliseFormula(input.formula);
  const phase = input.phase as Phase;
  const key = speciesKey(formula, phase);
  const composition = hillFormula(parseFormula(formula));
  return sequelize.transaction(async (transaction) => {
    const samePhase = await SpeciesRow.findAll({ where: { [Op.and]: [visibleTo(actor.workspaceId), { phase }] }, transaction });
    const clash = samePhase.find((s) => s.key === key || hillFormula(parseFormula(s.formula)) === composition);
    if (clash) {
      throw new AppError({
        status: 409,
        code: 'species_exists',
        message: `The species data already hold ${clash.key} (#${clash.id}, ${clash.workspaceId === null ? 'reference data' : 'this workspace'}); correct that row instead of adding another.`,
        fields: [{ field: 'formula', message: `already in the species data as ${clash.key}` }],
      });
    }
    const row = await SpeciesRow.create(
      {
        workspaceId: actor.workspaceId,
        key,
        formula,
        phase,
        name: input.name,
        dfhKjPerMol: input.dfH_kJ_per_mol ?? null,
        dfgKjPerMol: input.dfG_kJ_per_mol ?? null,
        sJPerMolK: input.S_J_per_mol_K ?? null,
        cpJPerMolK: input.Cp_J_per_mol_K ?? null,
        molarMassGPerMol: input.molarMass_g_per_mol ?? Math.round(molarMass(formula) * 1000) / 1000,
        source: input.source,
        createdById: actor.id,
        updatedById: actor.id,
      },
      { transaction },
    );
    const dto = toSpeciesDto(row);
    await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'species.create', entityType: 'species', entityId: row.id, detail: { before: null, after: dto, source: input.source } }, transaction);
    return dto;
  });
}

function valuesOf(dto: Species) {
  const { id: _id, version: _v, updatedAt: _u, ...values } = dto;
  return values;
}

/**
 * Corrects a species. A workspace row is edited in place (version checked). A reference row is
 * never changed: the workspace gets a correction with the same key, which replaces the reference
 * row for this workspace only. Either way the citation is required and the change is audited.
 */
export async function updateSpecies(actor: AuthUser, id: number, change: UpdateSpeciesRequest): Promise<Species> {
  return sequelize.transaction(async (transaction) => {
    const row = await getSpeciesRow(actor.workspaceId, id, transaction);
    if (row.version !== change.version) throw AppError.staleVersion('species');
    const values = {
      name: change.name ?? row.name,
      dfhKjPerMol: change.dfH_kJ_per_mol === undefined ? row.dfhKjPerMol : change.dfH_kJ_per_mol,
      dfgKjPerMol: change.dfG_kJ_per_mol === undefined ? row.dfgKjPerMol : change.dfG_kJ_per_mol,
      sJPerMolK: change.S_J_per_mol_K === undefined ? row.sJPerMolK : change.S_J_per_mol_K,
      cpJPerMolK: change.Cp_J_per_mol_K === undefined ? row.cpJPerMolK : change.Cp_J_per_mol_K,
      molarMassGPerMol: change.molarMass_g_per_mol ?? row.molarMassGPerMol,
      source: change.source,
      updatedById: actor.id,
    };
    const before = valuesOf(toSpeciesDto(row));
    if (row.workspaceId === null) {
      const existing = await SpeciesRow.findOne({ where: { workspaceId: actor.workspaceId, key: row.key }, transaction });
      if (existing) {
        throw AppError.conflict(`This workspace already corrects ${row.key} (species #${existing.id}); edit that row instead.`, 'already_corrected');
      }
      const correction = await SpeciesRow.create(
        { workspaceId: actor.workspaceId, key: row.key, formula: row.formula, phase: row.phase, correctsId: row.id, createdById: actor.id, ...values },
        { transaction },
      );
      const dto = toSpeciesDto(correction);
      await recordAudit(
        { workspaceId: actor.workspaceId, actorId: actor.id, action: 'species.correct', entityType: 'species', entityId: correction.id, detail: { correctsId: row.id, before, after: valuesOf(dto), source: change.source } },
        transaction,
      );
      return dto;
    }
    await row.update({ ...values, version: row.version + 1 }, { transaction });
    const dto = toSpeciesDto(row);
    await recordAudit(
      { workspaceId: actor.workspaceId, actorId: actor.id, action: 'species.update', entityType: 'species', entityId: row.id, detail: { before, after: valuesOf(dto), source: change.source } },
      transaction,
    );
    return dto;
  });
}

// ---------------------------------------------------------------------------------------------
// The chemistry library of a workspace, for the shared computations.

interface ReferenceData {
  species: SpeciesRecord[];
  dilution: DilutionSeries[];
  solubility: SolubilitySeries[];
  solutionHeatCapacity: SolutionHeatCapacityCoefficients[];
  freezingPoint: FreezingPointSeries[];
  eutectics: EutecticPoint[];
}

// Reference rows change only by migration (applied before the server starts), so one load per
// process is enough; workspace rows are read on every call.
let referenceCache: Promise<ReferenceData> | null = null;

function groupBy<T>(rows: T[], keyOf: (r: T) => string): Map<string, T[]> {
  const map = new Map<string, T[]>();
  for (const r of rows) {
    const k = keyOf(r);
    const list = map.get(k) ?? [];
    list.push(r);
    map.set(k, list);
  }
  return map;
}

async function loadReferenceData(): Promise<ReferenceData> {
  const where = { workspaceId: null };
  const [species, dilution, solubility, heat, freezing, eutectics] = await Promise.all([
    SpeciesRow.findAll({ where, order: [['id', 'ASC']] }),
    DilutionPointRow.findAll({ where, order: [['id', 'ASC']] }),
    SolubilityPointRow.findAll({ where, order: [['id', 'ASC']] }),
    SolutionHeatCapacityRow.findAll({ where, order: [['id', 'ASC']] }),
    FreezingPointRow.findAll({ where, order: [['id', 'ASC']] }),
    EutecticRow.findAll({ where, order: [['id', 'ASC']] }),
  ]);
  return {
    species: species.map(toRecord),
    dilution: [...groupBy(dilution, (r) => r.speciesKey)].map(([solute, rows]) => ({
      solute,
      points: rows.filter((r) => r.nH2oPerMol !== null).map((r) => ({ nH2O_per_mol: r.nH2oPerMol as number, dfH_kJ_per_mol: r.dfhKjPerMol })),
      dfH_infinite_kJ_per_mol: rows.find((r) => r.nH2oPerMol === null)?.dfhKjPerMol ?? null,
      source: rows[0]!.source,
    })),
    solubility: [...groupBy(solubility, (r) => r.speciesKey)].map(([solute, rows]) => ({
      solute,
      points: rows.map((r) => ({ tempC: r.tempC, gPer100gWater: r.gPer100gWater })),
      source: rows[0]!.source,
    })),
    solutionHeatCapacity: heat.map((h) => ({
      solute: h.speciesKey, a1: h.a1, a2: h.a2, a3: h.a3, a4: h.a4, a5: h.a5, a6: h.a6,
      massFractionMax: h.massFractionMax, tempMinC: h.tempMinC, tempMaxC: h.tempMaxC,
      ...(h.pointCount === null ? {} : { pointCount: h.pointCount }),
      source: h.source,
    })),
    freezingPoint: [...groupBy(freezing, (r) => r.speciesKey)].map(([solute, rows]) => ({
      solute,
      points: rows.map((r) => ({ massFraction: r.massFraction, depressionK: r.depressionK })),
      source: rows[0]!.source,
    })),
    eutectics: eutectics.map((e) => ({ solute: e.speciesKey, tempC: e.tempC, massFraction: e.massFraction, solidPhases: e.solidPhases, source: e.source })),
  };
}

/**
 * The ChemistryLibrary a workspace computes with: the reference data, with the workspace's own
 * species added and its corrections in place of the reference rows they correct.
 */
export async function workspaceChemistryLibrary(workspaceId: number): Promise<ChemistryLibrary> {
  referenceCache ??= loadReferenceData().catch((error) => {
    referenceCache = null;
    throw error;
  });
  const [reference, own] = await Promise.all([referenceCache, SpeciesRow.findAll({ where: { workspaceId }, order: [['id', 'ASC']] })]);
  const ownKeys = new Set(own.map((r) => r.key));
  return createChemistryLibrary({
    species: [...reference.species.filter((s) => !ownKeys.has(s.key)), ...own.map(toRecord)],
    dilution: reference.dilution,
    solubility: reference.solubility,
    solutionHeatCapacity: reference.solutionHeatCapacity,
    freezingPoint: reference.freezingPoint,
    eutectics: reference.eutectics,
  });
}
