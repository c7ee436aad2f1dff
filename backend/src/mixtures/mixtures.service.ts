import { UnknownSpeciesError, findSpecies } from '@shared/chemistry';
import type { ComputationWarning } from '@shared/chemistry/types';
import { candidateHazards, hazardDataForSpecies, type HazardCompositionEntry } from '@shared/hazards';
import { SKIN_CONTACT_BY_CASE } from '@shared/optimiser/candidate-hazards';
import { HAZARD_STANDING_CAUTION, ingredientHazardDataSchema, type IngredientHazardData } from '@shared/schemas/hazards';
import type { EvaluateMixtureApiResponse } from '@shared/schemas';
import type { EvaluateMixtureRequest } from '@shared/schemas/mixtures';
import { evaluateMixture } from '@shared/evaluation/evaluate-mixture';
import { resolveMixtureRequest } from '@shared/evaluation/resolve-mixture';
import { ThermalModelError, formulaProcessOptions, mixturePrecipitation } from '@shared/thermal';
import { AppError } from '../http/errors';
import type { AuthUser } from '../auth/session-user';
import { IngredientRecord } from '../ingredients/ingredient.model';
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

/** Hazard data stored on the workspace's ingredients, by id (null where none or unreadable). */
async function ingredientHazardData(workspaceId: number, ids: number[]): Promise<Map<number, IngredientHazardData | null>> {
  if (!ids.length) return new Map();
  const rows = await IngredientRecord.findAll({ where: { workspaceId, id: [...new Set(ids)] }, attributes: ['id', 'hazardData'] });
  return new Map(
    rows.map((r) => {
      const parsed = r.hazardData ? ingredientHazardDataSchema.safeParse(r.hazardData) : null;
      return [r.id, parsed?.success ? parsed.data : null];
    }),
  );
}

/** The thermal model's contact case as the hazard rules' skin exposure (the brief's mapping). */
function skinContact(request: EvaluateMixtureRequest) {
  const c = request.contact?.case;
  if (c === 'skin-fabric') return SKIN_CONTACT_BY_CASE['skin-through-fabric'];
  if (c === 'insulated') return SKIN_CONTACT_BY_CASE.insulated;
  return SKIN_CONTACT_BY_CASE['still-air'];
}

/**
 * Resolves each component (an ingredient of the member's workspace, or a bare formula) to its
 * process and runs the shared mixture evaluation. Unknown ids and formulas answer 400 naming the
 * component's field; data the model had to go beyond come back as warnings.
 */
export async function evaluateMixtureFor(actor: AuthUser, request: EvaluateMixtureRequest): Promise<EvaluateMixtureApiResponse> {
  const lib = await workspaceChemistryLibrary(actor.workspaceId);
  const ids = request.components.flatMap((c) => (c.ingredientId === undefined ? [] : [c.ingredientId]));
  const [ingredients, hazardById] = await Promise.all([ingredientsByIds(actor.workspaceId, ids), ingredientHazardData(actor.workspaceId, ids)]);
  const warnings: ComputationWarning[] = [];
  const r = resolveMixtureRequest(lib, ingredients, request);
  if (!r.ok) throw AppError.validation(`Invalid mixture: ${r.fields.map((f) => `${f.field}: ${f.message}`).join('; ')}`, r.fields);
  const described: EvaluateMixtureApiResponse['components'] = r.resolved.map((c) =>
    c.ingredient
      ? { ingredientId: c.ingredient.id, formula: null, name: c.ingredient.name, massG: c.massG, processKind: c.process.kind, processOptions: [] }
      : { ingredientId: null, formula: c.formula, name: c.formula, massG: c.massG, processKind: c.process.kind, processOptions: formulaProcessOptions(lib, c.formula) },
  );
  const costLines = r.resolved.flatMap((c) => (c.ingredient ? [{ costPerKg: c.ingredient.costPerKg, massG: c.massG, currency: c.ingredient.currency }] : []));
  const costComplete = r.resolved.every((c) => c.ingredient || c.massG === 0);

  // Hazard inputs of each component: an ingredient's stored hazard data, a formula's classification in the project's data.
  const hazardComposition: HazardCompositionEntry[] = [];
  const classificationStatements: string[] = [];
  r.resolved.forEach((c, k) => {
    if (c.ingredient) {
      if (c.ingredient.role !== 'packaging') {
        hazardComposition.push({ name: r.mixture.components[k]!.key ?? c.ingredient.name, massG: c.massG, hazardData: hazardById.get(c.ingredient.id) ?? null, process: c.process, densityGPerMl: c.ingredient.densityGPerMl ?? null });
      }
      return;
    }
    const isWater = c.process.kind === 'inert';
    const h = hazardDataForSpecies(isWater ? 'H2O(l)' : findSpecies(lib, c.formula, 'cr').key, c.formula);
    if (c.massG > 0 && !isWater) classificationStatements.push(h.statement);
    hazardComposition.push({ name: c.formula, massG: c.massG, hazardData: h.hazardData, process: c.process, ...(h.hazardData ? {} : { acuteToxicityUnknown: true }) });
  });

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

  // Ions of two ingredients that meet in the water (chemistry/precipitation.ts).
  const precipitation = mixturePrecipitation(lib, r.mixture.components, result);
  if (precipitation.precipitates.length) {
    warnings.push({ code: 'precipitation', message: `${precipitation.statement} The time curve does not include this solid or its heat yet.` });
  }
  warnings.push(...precipitation.warnings);

  // Hazards as for a candidate (shared/src/hazards), with the predicted temperatures of this mixture.
  const fill = hazardComposition.filter((c) => c.massG > 0);
  const hz = fill.length
    ? candidateHazards({
        composition: fill,
        predicted: { minTempC: result.minTempC, maxTempC: result.maxTempC, contact: skinContact(request), holdMin: request.holdMin },
        packType: result.maxTempC - request.initialTempC > request.initialTempC - result.minTempC ? 'warm' : 'cold',
      })
    : null;

  return {
    ...result,
    warnings: [...result.warnings, ...warnings],
    cost,
    components: described,
    hazards: hz?.notes ?? [],
    label: hz?.label ?? { pictograms: [], signalWord: null, hStatements: [], pStatements: [] },
    classification: hz?.classification ?? [],
    classificationStatements,
    standingCaution: HAZARD_STANDING_CAUTION,
    precipitation: {
      precipitates: precipitation.precipitates.map((p) => ({ solidKey: p.solidKey, name: p.name, mol: p.mol, massG: p.massG, log10Ksp: p.log10Ksp, heatReleasedJ: p.heatReleasedJ })),
      heatReleasedJ: precipitation.heatReleasedJ,
      statement: precipitation.statement,
      source: precipitation.source,
    },
  };
}
