import { readFileSync } from 'node:fs';
import path from 'node:path';
import { DataTypes } from 'sequelize';
import type {
  DilutionSeries,
  EutecticPoint,
  FreezingPointSeries,
  SolubilitySeries,
  SolutionHeatCapacityCoefficients,
  SpeciesRecord,
} from '../../../../shared/src/chemistry/types';
import type { MigrationContext } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

const dataDir = path.resolve(import.meta.dirname, '../../../../shared/src/chemistry/data');
function readData<T>(file: string): T {
  return JSON.parse(readFileSync(path.join(dataDir, file), 'utf8')) as T;
}

/**
 * Species data and the ingredient library.
 *
 * Reference data and corrections: rows with `workspace_id` NULL are the published reference data
 * (NBS 1982, CRC, Laliberté), seeded here from shared/src/chemistry/data and changed only by later
 * migrations. A chemist never edits them in place: adding a species creates a row owned by their
 * workspace, and correcting a reference species creates a workspace-owned row with the same key
 * (`corrects_id` pointing at the reference row) that replaces it for that workspace only. Every
 * such row carries its own citation (`source`), a `version`, and an audit event with before/after.
 * So each workspace sees "reference rows, overridden by its own rows", other workspaces are not
 * affected, and the reference value stays visible for comparison. The tabulated series (dilution,
 * solubility, heat capacity, freezing point, eutectic) carry the same nullable `workspace_id` so a
 * later change can let workspaces add series the same way.
 */
export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    const workspaceRef = { type: DataTypes.INTEGER, allowNull: true, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' } as const;
    const userRef = { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' } as const;

    await qi.createTable('species', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: workspaceRef,
      key: { type: DataTypes.STRING(120), allowNull: false },
      formula: { type: DataTypes.STRING(100), allowNull: false },
      phase: { type: DataTypes.STRING(2), allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      dfh_kj_per_mol: { type: DataTypes.DOUBLE, allowNull: true },
      dfg_kj_per_mol: { type: DataTypes.DOUBLE, allowNull: true },
      s_j_per_mol_k: { type: DataTypes.DOUBLE, allowNull: true },
      cp_j_per_mol_k: { type: DataTypes.DOUBLE, allowNull: true },
      molar_mass_g_per_mol: { type: DataTypes.DOUBLE, allowNull: false },
      source: { type: DataTypes.TEXT, allowNull: false },
      corrects_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'species', key: 'id' }, onDelete: 'SET NULL' },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      created_by_id: userRef,
      updated_by_id: userRef,
      ...timestamps,
    }, { transaction });
    await qi.sequelize.query(
      `ALTER TABLE species ADD CONSTRAINT species_phase_check CHECK (phase IN ('cr','l','g','aq','ai','ao'));
       CREATE UNIQUE INDEX species_reference_key ON species (key) WHERE workspace_id IS NULL;
       CREATE UNIQUE INDEX species_workspace_key ON species (workspace_id, key) WHERE workspace_id IS NOT NULL;
       CREATE INDEX species_formula ON species (lower(formula));`,
      { transaction },
    );

    await qi.createTable('dilution_points', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: workspaceRef,
      species_key: { type: DataTypes.STRING(120), allowNull: false },
      // NULL: the solute at infinite dilution.
      n_h2o_per_mol: { type: DataTypes.DOUBLE, allowNull: true },
      dfh_kj_per_mol: { type: DataTypes.DOUBLE, allowNull: false },
      source: { type: DataTypes.TEXT, allowNull: false },
    }, { transaction });
    await qi.addIndex('dilution_points', ['species_key'], { transaction });

    await qi.createTable('solubility_points', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: workspaceRef,
      species_key: { type: DataTypes.STRING(120), allowNull: false },
      temp_c: { type: DataTypes.DOUBLE, allowNull: false },
      g_per_100g_water: { type: DataTypes.DOUBLE, allowNull: false },
      source: { type: DataTypes.TEXT, allowNull: false },
    }, { transaction });
    await qi.addIndex('solubility_points', ['species_key'], { transaction });

    // Laliberté (2009) heat-capacity coefficients a1–a6 with their validity range.
    await qi.createTable('solution_heat_capacity', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: workspaceRef,
      species_key: { type: DataTypes.STRING(120), allowNull: false },
      a1: { type: DataTypes.DOUBLE, allowNull: false },
      a2: { type: DataTypes.DOUBLE, allowNull: false },
      a3: { type: DataTypes.DOUBLE, allowNull: false },
      a4: { type: DataTypes.DOUBLE, allowNull: false },
      a5: { type: DataTypes.DOUBLE, allowNull: false },
      a6: { type: DataTypes.DOUBLE, allowNull: false },
      mass_fraction_max: { type: DataTypes.DOUBLE, allowNull: false },
      temp_min_c: { type: DataTypes.DOUBLE, allowNull: false },
      temp_max_c: { type: DataTypes.DOUBLE, allowNull: false },
      point_count: { type: DataTypes.INTEGER, allowNull: true },
      source: { type: DataTypes.TEXT, allowNull: false },
    }, { transaction });

    await qi.createTable('freezing_points', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: workspaceRef,
      species_key: { type: DataTypes.STRING(120), allowNull: false },
      mass_fraction: { type: DataTypes.DOUBLE, allowNull: false },
      depression_k: { type: DataTypes.DOUBLE, allowNull: false },
      source: { type: DataTypes.TEXT, allowNull: false },
    }, { transaction });

    await qi.createTable('eutectics', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: workspaceRef,
      species_key: { type: DataTypes.STRING(120), allowNull: false },
      temp_c: { type: DataTypes.DOUBLE, allowNull: false },
      mass_fraction: { type: DataTypes.DOUBLE, allowNull: false },
      solid_phases: { type: DataTypes.STRING(200), allowNull: false },
      source: { type: DataTypes.TEXT, allowNull: false },
    }, { transaction });

    await qi.createTable('ingredients', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      name: { type: DataTypes.STRING(120), allowNull: false },
      grade: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
      role: { type: DataTypes.ENUM('active', 'solvent', 'additive', 'packaging'), allowNull: false },
      species_key: { type: DataTypes.STRING(120), allowNull: true },
      // Parsed with the shared ingredientProcessSchema (defaults applied) before it is stored.
      process: { type: DataTypes.JSONB, allowNull: true },
      // Money is decimal, never float.
      cost_per_kg: { type: DataTypes.DECIMAL(12, 4), allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      density_g_per_ml: { type: DataTypes.DOUBLE, allowNull: true },
      cp_j_per_g_k: { type: DataTypes.DOUBLE, allowNull: true },
      sources: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      created_by_id: userRef,
      updated_by_id: userRef,
      deleted_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction });
    await qi.sequelize.query(
      `CREATE UNIQUE INDEX ingredients_workspace_name_grade ON ingredients (workspace_id, lower(name), lower(grade)) WHERE deleted_at IS NULL;
       ALTER TABLE ingredients ADD CONSTRAINT ingredients_cost_check CHECK (cost_per_kg >= 0);`,
      { transaction },
    );

    await qi.createTable('attachments', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      ingredient_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'ingredients', key: 'id' }, onDelete: 'CASCADE' },
      filename: { type: DataTypes.STRING(255), allowNull: false },
      content_type: { type: DataTypes.STRING(100), allowNull: false },
      size_bytes: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
      bytes: { type: DataTypes.BLOB, allowNull: false },
      uploaded_by_id: userRef,
      created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    }, { transaction });
    await qi.addIndex('attachments', ['workspace_id', 'ingredient_id'], { transaction });

    // Reference data from the bundled files (sources named on every row).
    const now = new Date();
    const species = readData<SpeciesRecord[]>('species.json');
    await qi.bulkInsert('species', species.map((s) => ({
      workspace_id: null,
      key: s.key,
      formula: s.formula,
      phase: s.phase,
      name: s.name,
      dfh_kj_per_mol: s.dfH_kJ_per_mol,
      dfg_kj_per_mol: s.dfG_kJ_per_mol,
      s_j_per_mol_k: s.S_J_per_mol_K,
      cp_j_per_mol_k: s.Cp_J_per_mol_K,
      molar_mass_g_per_mol: s.molarMass_g_per_mol,
      source: s.source,
      version: 0,
      created_at: now,
      updated_at: now,
    })), { transaction });

    const dilution = readData<DilutionSeries[]>('dilution.json');
    const dilutionRows = dilution.flatMap((d) => [
      ...d.points.filter((p) => Number.isFinite(p.dfH_kJ_per_mol)).map((p) => ({ species_key: d.solute, n_h2o_per_mol: p.nH2O_per_mol, dfh_kj_per_mol: p.dfH_kJ_per_mol, source: d.source })),
      ...(d.dfH_infinite_kJ_per_mol == null ? [] : [{ species_key: d.solute, n_h2o_per_mol: null, dfh_kj_per_mol: d.dfH_infinite_kJ_per_mol, source: d.source }]),
    ]);
    if (dilutionRows.length) await qi.bulkInsert('dilution_points', dilutionRows, { transaction });

    const solubility = readData<SolubilitySeries[]>('solubility.json');
    // A point without a finite value (e.g. a melt, where g per 100 g water is unbounded) is not a solubility.
    const solubilityRows = solubility.flatMap((s) => s.points.filter((p) => Number.isFinite(p.gPer100gWater)).map((p) => ({ species_key: s.solute, temp_c: p.tempC, g_per_100g_water: p.gPer100gWater, source: s.source })));
    if (solubilityRows.length) await qi.bulkInsert('solubility_points', solubilityRows, { transaction });

    const heat = readData<SolutionHeatCapacityCoefficients[]>('solution-heat-capacity.json');
    if (heat.length) {
      await qi.bulkInsert('solution_heat_capacity', heat.map((h) => ({
        species_key: h.solute, a1: h.a1, a2: h.a2, a3: h.a3, a4: h.a4, a5: h.a5, a6: h.a6,
        mass_fraction_max: h.massFractionMax, temp_min_c: h.tempMinC, temp_max_c: h.tempMaxC, point_count: h.pointCount ?? null, source: h.source,
      })), { transaction });
    }

    const freezing = readData<FreezingPointSeries[]>('freezing-point.json');
    const freezingRows = freezing.flatMap((f) => f.points.filter((p) => Number.isFinite(p.depressionK)).map((p) => ({ species_key: f.solute, mass_fraction: p.massFraction, depression_k: p.depressionK, source: f.source })));
    if (freezingRows.length) await qi.bulkInsert('freezing_points', freezingRows, { transaction });

    const eutectics = readData<EutecticPoint[]>('eutectic.json');
    if (eutectics.length) {
      await qi.bulkInsert('eutectics', eutectics.map((e) => ({
        species_key: e.solute, temp_c: e.tempC, mass_fraction: e.massFraction, solid_phases: e.solidPhases, source: e.source,
      })), { transaction });
    }
  });
}

export async function down({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  for (const table of ['attachments', 'ingredients', 'eutectics', 'freezing_points', 'solution_heat_capacity', 'solubility_points', 'dilution_points', 'species']) {
    await qi.dropTable(table);
  }
  await qi.sequelize.query('DROP TYPE IF EXISTS "enum_ingredients_role";');
}
