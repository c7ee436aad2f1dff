import type { ContactCase as BriefContactCase } from '../schemas/briefs';
import type { ChemistryPort } from '../thermal/chemistry-port';
import type { IngredientProcessInput } from '../thermal/process';

/**
 * Calibrations the chemist has applied, as the optimiser and the time model read them: a UA
 * multiplier per contact case (measured exchange ÷ modelled exchange), and per ingredient a
 * dissolution/reaction rate constant and an effective enthalpy factor (measured heat ÷ heat
 * from the species data).
 */
export interface ModelCalibrations {
  contacts?: Partial<Record<BriefContactCase, { uaMultiplier: number; calibrationId?: number }>>;
  ingredients?: Record<string, { rateConstantPerMin?: number; enthalpyFactor?: number; calibrationId?: number }>;
}

/** The model's adjustable parameters: multipliers on the nominal figures (1 = as modelled); what a lab-log fit and the Monte Carlo band vary. */
export interface ModelParameters {
  uaMultiplier: number;
  /** On every dissolving solute's enthalpy of solution. */
  enthalpyFactor: number;
  /** On every process's rate constant. */
  rateMultiplier: number;
  /** On the pack's total heat capacity. */
  heatCapacityFactor: number;
}

export const NOMINAL_PARAMETERS: ModelParameters = { uaMultiplier: 1, enthalpyFactor: 1, rateMultiplier: 1, heatCapacityFactor: 1 };

/**
 * The UA multiplier a calibration gives a brief's contact case; 1 when the exchange is a UA given
 * directly (a measured UA is not re-calibrated) or the case has no calibration.
 */
export function contactUaMultiplier(calibrations: ModelCalibrations | null | undefined, contact: BriefContactCase, uaGivenDirectly: boolean): number {
  if (uaGivenDirectly) return 1;
  return calibrations?.contacts?.[contact]?.uaMultiplier ?? 1;
}

/** The species key of the solute whose enthalpy of solution an ingredient's dissolution uses. */
export function soluteKeyOf(process: IngredientProcessInput | null | undefined): string | null {
  if (!process || process.kind !== 'dissolution') return null;
  return process.soluteKey ?? process.solidKey;
}

/**
 * A process with a calibrated rate constant (dissolution, reaction, crystallisation and air
 * oxidation carry `rateConstantPerMin`; inert processes are returned unchanged).
 *
 * @example withRateConstant({ kind: 'dissolution', solidKey: 'NH4NO3(cr)' }, 0.8).rateConstantPerMin // → 0.8
 */
export function withRateConstant<P extends IngredientProcessInput>(process: P, rateConstantPerMin: number | undefined, source = 'calibrated against a lab log'): P {
  if (rateConstantPerMin === undefined || process.kind === 'inert') return process;
  if (process.kind === 'dissolution' || process.kind === 'reaction') return { ...process, rateConstantPerMin, rateConstantSource: source };
  return { ...process, rateConstantPerMin };
}

/** Ingredients with their calibrated rate constants applied (the enthalpy factor goes through the port). */
export function applyIngredientCalibrations<I extends { id: string; process: IngredientProcessInput | null }>(ingredients: readonly I[], calibrations?: ModelCalibrations | null): I[] {
  const byId = calibrations?.ingredients;
  if (!byId) return [...ingredients];
  return ingredients.map((i) => {
    const c = byId[i.id];
    if (!c || !i.process || c.rateConstantPerMin === undefined) return i;
    return { ...i, process: withRateConstant(i.process, c.rateConstantPerMin) };
  });
}

/** Enthalpy factor per solute key from the ingredient calibrations. */
export function enthalpyFactorsBySolute(ingredients: readonly { id: string; process: IngredientProcessInput | null }[], calibrations?: ModelCalibrations | null): Map<string, number> {
  const out = new Map<string, number>();
  const byId = calibrations?.ingredients;
  if (!byId) return out;
  for (const i of ingredients) {
    const f = byId[i.id]?.enthalpyFactor;
    const key = soluteKeyOf(i.process);
    if (f !== undefined && key && f !== 1) out.set(key, f);
  }
  return out;
}

/**
 * A chemistry port whose enthalpies of solution (integral and at infinite dilution) are scaled
 * by a factor per solute key — the effective enthalpy factor of a calibration, or a sample of
 * the enthalpy's uncertainty. `'*'` scales every solute. Everything else passes through.
 * Two ingredients with the same solute share its factor.
 *
 * @example scaledEnthalpyPort(port, new Map([['NH4NO3(cr)', 0.9]])).infiniteDilutionEnthalpy_kJ_per_mol('NH4NO3(cr)') // ≈ 0.9 × 25.7
 */
export function scaledEnthalpyPort(port: ChemistryPort, factors: ReadonlyMap<string, number>): ChemistryPort {
  if (factors.size === 0) return port;
  const all = factors.get('*');
  const f = (key: string) => factors.get(key) ?? all ?? 1;
  const scaled: ChemistryPort = {
    molarMass_g_per_mol: (k) => port.molarMass_g_per_mol(k),
    formationEnthalpy_kJ_per_mol: (k) => port.formationEnthalpy_kJ_per_mol(k),
    heatCapacity_J_per_mol_K: (k) => port.heatCapacity_J_per_mol_K(k),
    integralSolutionEnthalpy_kJ_per_mol: (k, n) => {
      const v = port.integralSolutionEnthalpy_kJ_per_mol(k, n);
      const s = f(k);
      return s === 1 ? v : { value: v.value * s, warnings: v.warnings };
    },
    infiniteDilutionEnthalpy_kJ_per_mol: (k) => port.infiniteDilutionEnthalpy_kJ_per_mol(k) * f(k),
    solubility_g_per_100g: (k, t) => port.solubility_g_per_100g(k, t),
    apparentSoluteCp_J_per_gK: (k, w, t) => port.apparentSoluteCp_J_per_gK(k, w, t),
    solutionCp_J_per_gK: (k, w, t) => port.solutionCp_J_per_gK(k, w, t),
  };
  if (port.freezingPointDepression_K) scaled.freezingPointDepression_K = (k, m) => port.freezingPointDepression_K!(k, m);
  if (port.eutectic) scaled.eutectic = (k) => port.eutectic!(k);
  return scaled;
}
