import { ingredientHazardDataSchema, type IngredientHazardData } from '@shared/schemas/hazards';
import type { IngredientHazardsResponse } from '@shared/schemas/reviews';
import { H_STATEMENTS, H_STATEMENTS_SOURCE } from '@shared/hazards/h-statements';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { IngredientRecord } from '../ingredients/ingredient.model';

function toDto(r: IngredientRecord): IngredientHazardsResponse {
  const parsed = r.hazardData ? ingredientHazardDataSchema.safeParse(r.hazardData) : null;
  return { ingredientId: r.id, name: r.grade ? `${r.name} (${r.grade})` : r.name, hazardData: parsed?.success ? parsed.data : null, hazardVersion: r.hazardVersion };
}

export async function getIngredientHazards(workspaceId: number, id: number): Promise<IngredientHazardsResponse> {
  const row = await IngredientRecord.findOne({ where: { id, workspaceId } });
  if (!row) throw AppError.notFound('Ingredient');
  return toDto(row);
}

/**
 * Replaces an ingredient's hazard data (or clears it with null). The client sends the hazard
 * version it loaded; a mismatch answers 409. Audited with the data before and after.
 */
export async function updateIngredientHazards(actor: AuthUser, id: number, hazardData: IngredientHazardData | null, version: number): Promise<IngredientHazardsResponse> {
  return sequelize.transaction(async (transaction) => {
    const row = await IngredientRecord.findOne({ where: { id, workspaceId: actor.workspaceId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw AppError.notFound('Ingredient');
    if (row.hazardVersion !== version) throw AppError.staleVersion('hazard data');
    const before = row.hazardData ?? null;
    await row.update({ hazardData, hazardVersion: row.hazardVersion + 1, updatedById: actor.id }, { transaction });
    await recordAudit(
      { workspaceId: actor.workspaceId, actorId: actor.id, action: 'ingredient.hazards.update', entityType: 'ingredient', entityId: row.id, detail: { before: { hazardData: before }, after: { hazardData }, hazardVersion: row.hazardVersion } },
      transaction,
    );
    return toDto(row);
  });
}

/** GHS H-statement texts (shared/src/hazards/h-statements.ts), in code order. */
export function hStatements() {
  return {
    statements: Object.entries(H_STATEMENTS)
      .map(([code, text]) => ({ code, text }))
      .sort((a, b) => a.code.localeCompare(b.code)),
    source: H_STATEMENTS_SOURCE,
  };
}
