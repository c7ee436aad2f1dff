import { UnknownSpeciesError } from '@shared/chemistry';
import type { ComputationWarning } from '@shared/chemistry/types';
import type { EvaluateMixtureApiResponse } from '@shared/schemas';
import type { EvaluateMixtureRequest } from '@shared/schemas/mixtures';
import { evaluateMixture } from '@shared/evaluation/evaluate-mixture';
import { resolveMixtureRequest } from '@shared/evaluation/resolve-mixture';
import { ThermalModelError } from '@shared/thermal';
import { AppError } from '../http/errors';
import type { AuthUser } from '../auth/session-user';
import { formatCost, ingredientsByIds } from '../ingredients/ingredients.service';
import { workspaceChemistryLibrary } from '../species/species.service';

/** Σ costPerKg × massG / 1000 in exact decimal arithmetic (1e-4 currency units × milligrams). */
function decimalCost(lines: { costPerKg: string; massG: number }[]): string {
  let numerator = 0n; // (1e-4 currency units per kg) × mg
  for (const line of lines) {
    const [whole = '0', frac = ''] = line.costPerKg.split('.');
    const units = BigInt(whole) * 10_000n + BigInt((frac + '0000').slice(0, 4));
    numerator += units * BigInt(Math.round(line.massG * 1000));
  }
  // ÷ 1e6 mg per kg, rounded half up, gives 1e-4 currency units.
  const tenThousandths = (numerator + 500_000n) / 1_000_000n;
  const whole = tenThousandths / 10_000n;
  return formatCost(`${whole}.${(tenThousandths % 10_000n).toString().padStart(4, '0')}`);
}

/**
 * Resolves each component (an ingredient of the member's workspace, or a bare formula) to its
 * process and runs the shared mixture evaluation. Unknown ids and formulas answer 400 naming the
 * component's field; data the model had to go beyond come back as warnings.
 */
export async function evaluateMixtureFor(actor: AuthUser, request: EvaluateMixtureRequest): Promise<EvaluateMixtureApiResponse> {
  const lib = await workspaceChemistryLibrary(actor.workspaceId);
  const ids = request.components.flatMap((c) => (c.ingredientId === undefined ? [] : [c.ingredientId]));
  const ingredients = await ingredientsByIds(actor.workspaceId, ids);
  const warnings: ComputationWarning[] = [];
  const r = resolveMixtureRequest(lib, ingredients, request);
  if (!r.ok) throw AppError.validation(`Invalid mixture: ${r.fields.map((f) => `${f.field}: ${f.message}`).join('; ')}`, r.fields);
  const described: EvaluateMixtureApiResponse['components'] = r.resolved.map((c) =>
    c.ingredient ? { ingredientId: c.ingredient.id, formula: null, name: c.ingredient.name, massG: c.massG, processKind: c.process.kind } : { ingredientId: null, formula: c.formula, name: c.formula, massG: c.massG, processKind: c.process.kind },
  );
  const costLines = r.resolved.flatMap((c) => (c.ingredient ? [{ costPerKg: c.ingredient.costPerKg, massG: c.massG, currency: c.ingredient.currency }] : []));
  const costComplete = r.resolved.every((c) => c.ingredient || c.massG === 0);

  let result;
  try {
    // The library's chemistry model comes from the one cache (evaluation/chemistry-cache.ts).
    result = evaluateMixture(lib, r.mixture);
  } catch (error) {
    if (error instanceof ThermalModelError || error instanceof UnknownSpeciesError) {
      const path = error instanceof ThermalModelError ? (error.field ?? '') : '';
      const m = /^components\.(\d+)/.exec(path);
      const k = m ? Number(m[1]) : -1;
      const field = k >= 0 && request.components[k] ? `components.${k}.${request.components[k]!.ingredientId !== undefined ? 'ingredientId' : 'formula'}` : path || 'components';
      throw AppError.validation(error.message, [{ field, message: error.message }]);
    }
    throw error;
  }

  const currencies = new Set(costLines.map((l) => l.currency));
  let cost: EvaluateMixtureApiResponse['cost'] = null;
  if (currencies.size > 1) {
    warnings.push({ code: 'mixed-currencies', message: `The ingredients are costed in ${[...currencies].join(', ')}; no total cost is given.` });
  } else if (costLines.length > 0) {
    cost = { amount: decimalCost(costLines), currency: [...currencies][0]!, complete: costComplete };
  }
  if (!costComplete) warnings.push({ code: 'cost-incomplete', message: 'Components given as bare formulas have no cost in the library; the cost covers the library ingredients only.' });

  return { ...result, warnings: [...result.warnings, ...warnings], cost, components: described, hazards: [] };
}
