import { Op, col, fn, where as sqlWhere } from 'sequelize';
import { DEMO_INGREDIENTS, HARBOUR_INGREDIENTS, type DemoIngredient } from '@shared/demo/ingredients';
import { createIngredientRequestSchema, ingredientNeedsSchema, ingredientRuleErrors, type CreateIngredientRequest } from '@shared/schemas';
import type { z } from 'zod';
import { registerSeedStep } from '../db/seed';
import { workspaceChemistryLibrary } from '../species/species.service';
import { IngredientRecord } from './ingredient.model';
import { referenceErrors, valuesFromCreate } from './ingredients.service';

// The demo ingredient libraries come from the one demo data module (shared/src/demo/ingredients.ts),
// which the optimiser's benchmark and tests use too; here each record becomes a create request.

/** A demo record as the create-ingredient request the API would accept. */
export function demoIngredientRequest(item: DemoIngredient): z.input<typeof createIngredientRequestSchema> {
  return {
    name: item.name,
    grade: item.grade,
    role: item.role,
    process: item.process,
    costPerKg: item.costPerKg,
    densityGPerMl: item.densityGPerMl,
    ...(item.cpJPerGK !== undefined ? { cpJPerGK: item.cpJPerGK } : {}),
    ...(item.speciesKey !== undefined ? { speciesKey: item.speciesKey } : {}),
    sources: item.sources,
    notes: item.notes,
  };
}

async function seedLibrary(workspaceId: number, currency: string, items: readonly DemoIngredient[]) {
  const lib = await workspaceChemistryLibrary(workspaceId);
  const idByKey = new Map<string, number>();
  for (const item of items) {
    const parsed: CreateIngredientRequest = createIngredientRequestSchema.parse(demoIngredientRequest(item));
    const values = valuesFromCreate(parsed, currency);
    const problems = [...ingredientRuleErrors(values), ...referenceErrors(lib, values)];
    if (problems.length) throw new Error(`Demo ingredient ${item.name} (${item.grade}) is invalid: ${problems.map((p) => `${p.field} ${p.message}`).join('; ')}`);
    const existing = await IngredientRecord.findOne({
      where: { [Op.and]: [{ workspaceId }, sqlWhere(fn('lower', col('name')), values.name.toLowerCase()), sqlWhere(fn('lower', col('grade')), values.grade.toLowerCase())] },
      paranoid: false,
    });
    idByKey.set(item.key, existing ? existing.id : (await IngredientRecord.create({ ...values, workspaceId })).id);
  }
  // Needs name other records, so they are filled once every record has its id; a record whose
  // needs someone already set is left as it is.
  for (const item of items) {
    if (!item.needs?.length) continue;
    const needs = item.needs.map((n) => {
      const ingredientId = idByKey.get(n.key);
      if (ingredientId === undefined) throw new Error(`Demo ingredient ${item.name} (${item.grade}) needs "${n.key}", which this library does not hold.`);
      return { ingredientId, minGPerG: n.minGPerG, ...(n.maxGPerG !== undefined ? { maxGPerG: n.maxGPerG } : {}), ...(n.source ? { source: n.source } : {}) };
    });
    const parsed = ingredientNeedsSchema.parse(needs);
    const row = await IngredientRecord.findByPk(idByKey.get(item.key)!, { paranoid: false });
    if (row && (row.needs ?? []).length === 0) await row.update({ needs: parsed });
  }
}

registerSeedStep(async (workspaces) => {
  const demo = workspaces.get('demo');
  if (demo) await seedLibrary(demo.id, demo.currency, DEMO_INGREDIENTS);
  const harbour = workspaces.get('harbour');
  if (harbour) await seedLibrary(harbour.id, harbour.currency, HARBOUR_INGREDIENTS);
});
