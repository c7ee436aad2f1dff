import { readFileSync } from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import type { SpeciesRecord } from '../../../../shared/src/chemistry/types';
import type { MigrationContext } from '../migrator';

const dataDir = path.resolve(import.meta.dirname, '../../../../shared/src/chemistry/data');

/** Reference species added to species.json after 0002 (sparingly soluble salts for the precipitation check). */
const ADDED_KEYS = ['BaSO4(cr)', 'BaCO3(cr)'] as const;

/**
 * Adds the reference rows (workspace_id NULL) of {@link ADDED_KEYS} from the bundled
 * species.json where a database does not have them yet. A database created after the keys were
 * added already got them from 0002, so only the missing ones are inserted.
 */
export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  const species = JSON.parse(readFileSync(path.join(dataDir, 'species.json'), 'utf8')) as SpeciesRecord[];
  await qi.sequelize.transaction(async (transaction) => {
    const present = await qi.sequelize.query<{ key: string }>('SELECT key FROM species WHERE workspace_id IS NULL AND key IN (:keys)', {
      replacements: { keys: [...ADDED_KEYS] },
      type: QueryTypes.SELECT,
      transaction,
    });
    const have = new Set(present.map((r) => r.key));
    const now = new Date();
    const rows = species
      .filter((s) => (ADDED_KEYS as readonly string[]).includes(s.key) && !have.has(s.key))
      .map((s) => ({
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
      }));
    if (rows.length) await qi.bulkInsert('species', rows, { transaction });
  });
}

/** Nothing to undo safely: on a database created after the keys were added, 0002 owns these rows. */
export async function down() {}
