import { FormulaError, UnknownSpeciesError, findSpecies } from '@shared/chemistry';
import { candidateHazards, hazardDataForSpecies, type HazardCompositionEntry } from '@shared/hazards';
import { SKIN_CONTACT_BY_CASE } from '@shared/optimiser/candidate-hazards';
import { HAZARD_STANDING_CAUTION, ingredientHazardDataSchema, type IngredientHazardData } from '@shared/schemas/hazards';
import type { ChemistryLibrary, ComputationWarning } from '@shared/chemistry/types';
import type { EvaluateMixtureApiResponse, FieldError } from '@shared/schemas';
import type { EvaluateMixtureRequest, ResolvedMixture } from '@shared/schemas/mixtures';
import {
  ThermalModelError,
  chemistryPort,
  evaluateMixture,
  formulaProcessOptions,
  mixturePrecipitation,
  mixtureInputProblems,
  processForFormula,
  type ChemistryPort,
  type IngredientProcessInput,
} from '@shared/thermal';
import { AppError } from '../http/errors';
import type { AuthUser } from '../auth/session-user';
import { IngredientRecord } from '../ingredients/ingredient.model';
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
  const hazardComposition: HazardCompositionEntry[] = [];
  const classificationStatements: string[] = [];
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
      const key = `${ing.name}${ing.grade ? ` (${ing.grade})` : ''}`;
      components.push({ key, massG: c.massG, process });
      described.push({ ingredientId: ing.id, formula: null, name: ing.name, massG: c.massG, processKind: process.kind, processOptions: [] });
      if (ing.role !== 'packaging') hazardComposition.push({ name: key, massG: c.massG, hazardData: hazardById.get(ing.id) ?? null, process, densityGPerMl: ing.densityGPerMl ?? null });
      costLines.push({ costPerKg: ing.costPerKg, massG: c.massG, currency: ing.currency });
    } else {
      const formula = c.formula as string;
      try {
        const process = processForFormula(lib, formula, c.process);
        const processOptions = formulaProcessOptions(lib, formula);
        components.push({ formula, massG: c.massG, process });
        described.push({ ingredientId: null, formula, name: formula, massG: c.massG, processKind: process.kind, processOptions });
        const isWater = process.kind === 'inert';
        const speciesKey = isWater ? 'H2O(l)' : findSpecies(lib, formula, 'cr').key;
        const h = hazardDataForSpecies(speciesKey, formula);
        if (c.massG > 0 && !isWater) classificationStatements.push(h.statement);
        hazardComposition.push({ name: formula, massG: c.massG, hazardData: h.hazardData, process, ...(h.hazardData ? {} : { acuteToxicityUnknown: true }) });
        if (c.massG > 0) costComplete = false;
      } catch (error) {
        if (error instanceof UnknownSpeciesError || error instanceof FormulaError) fields.push({ field: `components.${k}.formula`, message: error.message });
        else throw error;
      }
    }
  });
  if (fields.length) throw AppError.validation(`Invalid mixture: ${fields.map((f) => `${f.field}: ${f.message}`).join('; ')}`, fields);

  // Mixtures that would pass silently: every mass 0, a salt with no water (thermal/mixture-input-checks.ts).
  const problems = mixtureInputProblems(components, (k) => (request.components[k]!.ingredientId !== undefined ? 'ingredientId' : 'formula'));
  if (problems.length) throw AppError.validation(`Invalid mixture: ${problems.map((f) => `${f.field}: ${f.message}`).join('; ')}`, problems);

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

  // Ions of two ingredients that meet in the water (chemistry/precipitation.ts).
  const precipitation = mixturePrecipitation(lib, components, result);
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
