import { Op } from 'sequelize';
import { demoHazardDataFor } from '@shared/hazards';
import { registerSeedStep } from '../db/seed';
import { IngredientRecord } from '../ingredients/ingredient.model';

/**
 * Demo hazard data (shared/src/hazards/demo-hazard-data.ts) onto the demo workspaces' ingredients,
 * matched by name. Only ingredients without hazard data are filled, so a chemist's edits stay.
 */
registerSeedStep(async (workspaces) => {
  const ids = [...workspaces.values()].map((w) => w.id);
  const rows = await IngredientRecord.findAll({ where: { workspaceId: { [Op.in]: ids }, hazardData: { [Op.is]: null } } });
  for (const row of rows) {
    const data = demoHazardDataFor(row.name);
    if (data) await row.update({ hazardData: data }, { hooks: false, silent: true });
  }
});
