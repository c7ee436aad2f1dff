import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * What an ingredient needs beside it in a mixture, in grams per gram of it (iron powder needs
 * salt, carbon, a water-holding filler and water): `ingredients.needs`, a JSONB array of
 * `{ ingredientId, minGPerG, maxGPerG?, source? }` naming ingredients of the same workspace
 * (validated by ingredientNeedsSchema and the ingredients service). The optimiser adds them to
 * every set that holds the ingredient and constrains their ratio.
 */
export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.addColumn('ingredients', 'needs', { type: DataTypes.JSONB, allowNull: false, defaultValue: [] });
}

export async function down({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.removeColumn('ingredients', 'needs');
}
