import { FormulaError, UnknownSpeciesError } from '@shared/chemistry';
import type { ChemistryLibrary, ComputationWarning } from '@shared/chemistry/types';
import type { EvaluateMixtureApiResponse, FieldError } from '@shared/schemas';
import type { EvaluateMixtureRequest, ResolvedMixture } from '@shared/schemas/mixtures';
import { ThermalModelError, chemistryPort, evaluateMixture, processForFormula, type ChemistryPort, type IngredientProcessInput } from '@shared/thermal';
import { AppError } from '../http/errors';
import type { AuthUser } from '../auth/session-user';
import { formatCost, ingredientsByIds } from '../ingredients/ingredients.service';
import { workspaceChemistryLibrary } from '../species/species.service';

// Sampling the chemistry curves for the port costs a few milliseconds per solute; keep the port
// of the last library each workspace used while its species rows are unchanged.
const portCache = new Map<number, { stamp: string; port: ChemistryPort }>();

function libraryStamp(lib: ChemistryLibrary): string {
  return lib.species.map((s) => `${s.key}:${s.dfH_kJ_per_mol}:${s.S_J_per_mol_K}:${s.Cp_J_per_mol_K}:${s.molarMass_g_per_mol}`).join('|');
}

function portFor(workspaceId: number, lib: ChemistryLibrary): ChemistryPort {
  const stamp = libraryStamp(lib);
  const cached = portCache.get(workspaceId);
  if (cached && cached.stamp === stamp) return cached.port;
  const port = chemistryPort(lib);
  portCache.set(workspaceId, { stamp, port });
  return port;
}

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
  const fields: FieldError[] = [];
  const warnings: ComputationWarning[] = [];
  const costLines: { costPerKg: string; massG: number; currency: string }[] = [];
  let costComplete = true;
  const components: ResolvedMixture['components'] = [];
  const described: EvaluateMixtureApiResponse['components'] = [];

  request.components.forEach((c, k) => {
    if (c.ingredientId !== undefined) {
      const ing = ingredients.get(c.ingredientId);
      if (!ing) {
        fields.push({ field: `components.${k}.ingredientId`, message: `no ingredient ${c.ingredientId} in this workspace's library` });
        return;
      }
      const process: IngredientProcessInput =
        ing.process ??
        (ing.role === 'solvent'
          ? { kind: 'inert', role: 'water' }
          : { kind: 'inert', role: ing.role === 'packaging' ? 'packaging' : 'additive', ...(ing.cpJPerGK ? { cp_J_per_gK: ing.cpJPerGK } : {}) });
      components.push({ key: `${ing.name}${ing.grade ? ` (${ing.grade})` : ''}`, massG: c.massG, process });
      described.push({ ingredientId: ing.id, formula: null, name: ing.name, massG: c.massG, processKind: process.kind });
      costLines.push({ costPerKg: ing.costPerKg, massG: c.massG, currency: ing.currency });
    } else {
      const formula = c.formula as string;
      try {
        const process = processForFormula(lib, formula);
        components.push({ formula, massG: c.massG, process });
        described.push({ ingredientId: null, formula, name: formula, massG: c.massG, processKind: process.kind });
        if (c.massG > 0) costComplete = false;
      } catch (error) {
        if (error instanceof UnknownSpeciesError || error instanceof FormulaError) fields.push({ field: `components.${k}.formula`, message: error.message });
        else throw error;
      }
    }
  });
  if (fields.length) throw AppError.validation(`Invalid mixture: ${fields.map((f) => `${f.field}: ${f.message}`).join('; ')}`, fields);

  const { components: _ignored, ...conditions } = request;
  let result;
  try {
    result = evaluateMixture(portFor(actor.workspaceId, lib), { ...conditions, components });
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
