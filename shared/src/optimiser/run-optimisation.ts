import type { ChemistryLibrary } from '../chemistry/types';
import {
  briefSchema,
  type Brief,
  type BriefInput,
  type Candidate,
  type ConcentrationCap,
  type InfeasibleSet,
  type OptimisationResult,
  type Verification,
} from '../schemas/briefs';
import type { ChemistryPort } from '../thermal/chemistry-port';
import type { TimeProfileResult } from '../thermal/time-profile';
import { REFERENCE_TEMP_C } from '../thermal/constants';
import { diagnoseInfeasible } from './diagnose-infeasible';
import { enumerateSets } from './enumerate-sets';
import { solveSetIterated, saturationEstimate, type EnthalpyIterationOptions, type IteratedSet } from './iterate-enthalpy';
import {
  gramsByIngredient,
  ingredientCoefficients,
  objectiveValue,
  parseIngredient,
  rowValue,
  thermalContext,
  usefulHeatJPerG,
  type LinearModel,
  type ParsedIngredient,
  type ThermalContext,
} from './linear-model';
import { orderByObjective, paretoFlags, rankCandidates, type RankItem } from './rank';
import { sensitivityOf } from './sensitivity';
import type { LpCounter } from './solve-set';
import type { OptimiserIngredient, OptimiserWarning } from './types';
import { verifyComposition } from '../evaluation/verify';
import { lineOf } from '../evaluation/components';
import { chemistryModelFor } from '../evaluation/chemistry-cache';
import { hazardCapsFor } from '../hazards/optimiser-hazards';
import { hazardsOfCandidate } from './candidate-hazards';
import { candidateIncompatibilities } from './incompatible-sets';
import { applyIngredientCalibrations, contactUaMultiplier, enthalpyFactorsBySolute, scaledEnthalpyPort, type ModelCalibrations } from '../calibration/calibrations';

/** What a run is doing: solving the sets' LPs, simulating candidates, computing hazard notes. */
export type RunStage = 'solving' | 'verifying' | 'hazards';
/** Progress: `done` of `total` steps (sets solved + candidates simulated), and the stage. */
export type ProgressCallback = (done: number, total: number, stage?: RunStage) => void;

export interface RunOptimisationInput {
  /** A brief (parsed, or as written: it is parsed with briefSchema, defaults applied). */
  brief: Brief | BriefInput;
  ingredients: readonly OptimiserIngredient[];
  /** Species data; ignored when `options.port` is given. */
  chemistry: ChemistryLibrary;
  /** Same as `options.onProgress` (either place works). */
  onProgress?: ProgressCallback;
  /** Same as `options.isCancelled`. */
  isCancelled?: () => boolean;
  /** Applied lab calibrations (lab-logs/calibrations.ts): UA per contact case, rate constants and enthalpy factors per ingredient. */
  calibrations?: ModelCalibrations | null;
}

export interface RunOptimisationOptions {
  /** Called after each set and each verification with (done, total) and what the run is doing. */
  onProgress?: ProgressCallback;
  /** Checked before each set and each verification; true stops the run (status `cancelled`, partial results). */
  isCancelled?: () => boolean;
  /** How many of the best candidates to verify with the time model (default 20). */
  verifyTop?: number;
  /** Concentration caps from outside the brief (the hazards module). */
  extraCaps?: readonly ConcentrationCap[];
  /** A chemistry port to reuse across runs (its sampled curves are cached); default one built over `chemistry`. */
  port?: ChemistryPort;
  /** Diagnose every infeasible set (default true). */
  diagnose?: boolean;
  /** Sensitivity of the verified candidates' binding constraints (default true). */
  sensitivity?: boolean;
  iteration?: EnthalpyIterationOptions;
  /** Integrator tolerance of the verification (default 1e-5). */
  verifyRtol?: number;
  /**
   * `all` (default): simulate every distinct candidate. `best-passing`: simulate in objective
   * order only until no later set can beat the best one that passed (a set's corrected optimum
   * is never better than its first LP optimum, so the first LP objective bounds it): what the
   * target sweep needs, the best objective that passes in simulation.
   */
  verifyMode?: 'all' | 'best-passing';
  /** Leave out actives a cheaper one of the same chemistry dominates (dominance.ts); default true. Off only to check the pruning against full enumeration. */
  pruneDominated?: boolean;
  /** Return the final LP of every set (`solvedSets`), for cross-checks; default false (the result stays small and clonable). */
  keepSolvedSets?: boolean;
}

/** The optimisation result plus what tests and the benchmark look at. */
export interface RunOptimisationOutput extends OptimisationResult {
  /** Final LP of every set solved (feasible or not), in enumeration order; only with `keepSolvedSets`. */
  solvedSets?: IteratedSet[];
}

interface Working extends RankItem {
  iterated: IteratedSet;
  candidate: Candidate;
  effectiveKey: string;
}

/**
 * The whole optimisation of a brief, as a pure function:
 * 1. parse the brief, build the thermal context (UA, exchange temperature, limits);
 * 2. leave out actives that cannot help (heat the wrong way at the target, or a melt whose
 *    melting point is below a warm target), then enumerate 1…maxActives sets
 *    (enumerate-sets.ts);
 * 3. solve each set's LP with the enthalpy-of-solution iteration (iterate-enthalpy.ts);
 *    diagnose the infeasible ones (diagnose-infeasible.ts);
 * 4. drop a candidate whose composition is that of a simpler set (an active at 0 g): ties go
 *    to the simpler mixture;
 * 5. order by the objective, verify the best `verifyTop` with the time model (verify.ts), then
 *    mark incompatible sets (incompatible-sets.ts) and rank: passed, not verified, missed,
 *    failed; within each, compatible first unless the brief's allowIncompatible; objective;
 *    simpler first (rank.ts); flag the Pareto front; sensitivity of the verified candidates'
 *    binding constraints.
 * Progress is reported through `onProgress(done, total)`, total = sets + verifications (the
 * verification count is known once the sets are solved, so total may shrink then);
 * `isCancelled()` is polled between steps.
 */
export function runOptimisation(input: RunOptimisationInput, runOptions: RunOptimisationOptions = {}): RunOptimisationOutput {
  const options: RunOptimisationOptions = {
    ...runOptions,
    ...(runOptions.onProgress ?? input.onProgress ? { onProgress: runOptions.onProgress ?? input.onProgress } : {}),
    ...(runOptions.isCancelled ?? input.isCancelled ? { isCancelled: runOptions.isCancelled ?? input.isCancelled } : {}),
  };
  const brief: Brief = briefSchema.parse(input.brief);
  const calibrations = input.calibrations ?? null;
  if (calibrations) input = { ...input, ingredients: applyIngredientCalibrations(input.ingredients, calibrations) };
  const basePort = options.port ?? chemistryModelFor(input.chemistry);
  const port = scaledEnthalpyPort(basePort, enthalpyFactorsBySolute(input.ingredients, calibrations));
  const uaMultiplier = contactUaMultiplier(calibrations, brief.contact, brief.uaWPerK !== null && brief.uaWPerK !== undefined);
  // Cap tokens among the excluded hazard classes (`precursor-an`, `cap:eye-dam-1`, …) become caps (hazards/optimiser-hazards.ts).
  const hazardCaps = hazardCapsFor(brief.excludedHazardClasses, input.ingredients);
  const ctx = thermalContext(brief, [...(options.extraCaps ?? []), ...hazardCaps], uaMultiplier);
  const verifyTop = Math.max(0, options.verifyTop ?? Infinity);
  const counter: LpCounter = { count: 0 };
  const warnings = new Map<string, OptimiserWarning>();
  const addWarnings = (ws: readonly OptimiserWarning[], subject: string) => {
    for (const w of ws) {
      const id = `${w.code}|${subject}`;
      if (!warnings.has(id)) warnings.set(id, { code: w.code, message: `${subject}: ${w.message}` });
    }
  };

  const parsed = new Map<string, ParsedIngredient>();
  const parseErrors = new Map<string, string>();
  for (const i of input.ingredients) {
    try {
      parsed.set(i.id, parseIngredient(port, i, brief.packAreaM2));
    } catch (e) {
      parseErrors.set(i.id, (e as Error).message);
    }
  }
  const enumeration = enumerateSets(brief, input.ingredients, (i) => {
    const err = parseErrors.get(i.id);
    if (err) return `cannot be modelled: ${err}`;
    for (const n of i.needs ?? []) if (parseErrors.has(n.ingredientId)) return `needs ${n.ingredientId}, which cannot be modelled`;
    return uselessReason(parsed.get(i.id)!, ctx, port);
  }, { pruneDominated: options.pruneDominated !== false });

  const sets = enumeration.sets;
  let total = sets.length + Math.min(verifyTop, sets.length);
  let done = 0;
  let cancelled = false;
  const solvedSets: IteratedSet[] = [];
  const infeasible: InfeasibleSet[] = [];
  const working: Working[] = [];
  let unsettled = 0;
  for (const set of sets) {
    if (options.isCancelled?.()) {
      cancelled = true;
      break;
    }
    const members = set.members.map((m) => parsed.get(m.id)!);
    let it: IteratedSet;
    try {
      it = solveSetIterated(set, members, ctx, port, options.iteration, counter);
    } catch (e) {
      const names = set.members.filter((m) => set.activeIds.includes(m.id)).map((m) => m.name);
      infeasible.push({ setIds: set.activeIds, setNames: names, blocking: [], reason: `cannot be modelled: ${(e as Error).message}` });
      done++;
      options.onProgress?.(done, total, 'solving');
      continue;
    }
    solvedSets.push(it);
    if (it.solution.status === 'optimal') {
      if (!it.settled) unsettled++;
      for (const c of it.model.coefficients) addWarnings(c.warnings, c.ingredient.name);
      working.push(toWorking(it, ctx));
    } else if (options.diagnose !== false) {
      infeasible.push(diagnoseInfeasible(it.model, counter));
    } else {
      infeasible.push({ setIds: set.activeIds, setNames: activeNames(it.model), blocking: [], reason: 'infeasible (not diagnosed)' });
    }
    done++;
    options.onProgress?.(done, total, 'solving');
  }

  // Ties to the simpler mixture: a set whose optimum leaves an active at 0 g is the simpler set.
  // Of the sets that come to the same effective mixture, keep the one with the fewest actives
  // (so no candidate lists an active at 0 g); equal sizes keep the better objective.
  const bestByKey = new Map<string, Working>();
  for (const w of orderByObjective(working, brief.objective)) {
    const kept = bestByKey.get(w.effectiveKey);
    if (!kept || w.setSize < kept.setSize) bestByKey.set(w.effectiveKey, w);
  }
  const keep = new Set(bestByKey.values());
  let distinct = orderByObjective(working, brief.objective).filter((w) => keep.has(w));

  // Every distinct candidate is simulated (verifyTop only bounds it for tests and benchmarks); a
  // miss is corrected and solved again (closing the loop) before it is listed apart.
  let verified = 0;
  let correctedSets = 0;
  const toVerify = distinct.slice(0, verifyTop);
  if (!cancelled) total = done + toVerify.length;
  const simulate = (w: Working): { verification: Verification; profile: TimeProfileResult | null } => {
    // The evaluation core applies the calibrations itself (over the uncalibrated port).
    const lines = gramsByIngredient(w.iterated.model.coefficients, w.iterated.solution.massesG).map((g) => lineOf(g.ingredient, g.massG));
    const { profile, evaluation: _evaluation, ...verification } = verifyComposition(basePort, brief, lines, {
      ...(options.verifyRtol !== undefined ? { rtol: options.verifyRtol } : {}),
      calibrations,
    });
    return { verification, profile };
  };
  const finalOf = new Map<Working, Working>();
  const dir = brief.objective === 'most-hold-margin' ? -1 : 1;
  let bestPassing: number | null = null;
  for (const w0 of toVerify) {
    if (cancelled || options.isCancelled?.()) {
      cancelled = true;
      break;
    }
    if (options.verifyMode === 'best-passing' && bestPassing !== null && dir * (w0.objectiveValue - bestPassing) >= 0) break;
    const members = w0.iterated.set.members.map((m) => parsed.get(m.id)!);
    let w = w0;
    let v = simulate(w);
    let rounds = 0;
    let correctionJ = 0;
    while (v.verification.status === 'missed' && rounds < MAX_CORRECTION_ROUNDS) {
      const step = correctionStep(w.iterated.model, v.verification, brief);
      if (step === null) break;
      correctionJ += step;
      rounds++;
      let it: IteratedSet;
      try {
        it = solveSetIterated(w0.iterated.set, members, { ...ctx, heatBudgetCorrectionJ: correctionJ }, port, options.iteration, counter);
      } catch {
        break;
      }
      if (it.solution.status !== 'optimal') break;
      const next = toWorking(it, ctx);
      const nv = simulate(next);
      // Keep the corrected optimum when it passes or misses by less; otherwise stop and list the
      // set's first optimum (the correction bought nothing).
      if (nv.verification.status === 'passed' || (nv.verification.status === 'missed' && (nv.verification.holdMarginMin ?? -Infinity) > (v.verification.holdMarginMin ?? -Infinity) + 1e-6)) {
        w = next;
        v = nv;
      } else break;
    }
    if (rounds > 0) correctedSets++;
    w.candidate.correction = { rounds, heatBudgetCorrectionJ: w === w0 ? 0 : (w.iterated.model.context.heatBudgetCorrectionJ ?? 0), finalHoldMarginMin: v.verification.holdMarginMin };
    if (v.profile) {
      addWarnings(v.profile.warnings, w.candidate.setNames.join(' + '));
      w.candidate.warnings = dedupeWarnings([...w.candidate.warnings, ...v.profile.warnings]);
    }
    applyVerification(w, v.verification);
    if (options.sensitivity !== false) {
      w.candidate.sensitivity = sensitivityOf(w.iterated.model, w.iterated.solution.binding, w.iterated.solution.objectiveValue, counter);
    }
    finalOf.set(w0, w);
    if (v.verification.status === 'passed' && (bestPassing === null || dir * (w.objectiveValue - bestPassing) < 0)) bestPassing = w.objectiveValue;
    verified++;
    done++;
    options.onProgress?.(done, total, 'verifying');
  }
  // Sets beyond verifyTop (tests and benchmarks only) or after a cancel stay as they were, not verified.
  distinct = distinct.map((w) => finalOf.get(w) ?? w);

  // Hazard notes and score of every distinct candidate (verified temperatures where known); the score feeds ranking ties and the Pareto front.
  const byId = new Map(input.ingredients.map((i) => [i.id, i]));
  for (const w of distinct) {
    try {
      const { hazards, warnings: hw } = hazardsOfCandidate(w.candidate, brief, byId);
      if (hazards) {
        w.candidate.hazards = hazards;
        w.candidate.hazardScore = hazards.score;
        w.hazardScore = hazards.score;
      }
      if (hw.length) w.candidate.warnings = dedupeWarnings([...w.candidate.warnings, ...hw]);
    } catch (e) {
      w.candidate.warnings.push({ code: 'hazards.failed', message: `hazard notes could not be computed: ${(e as Error).message}` });
    }
  }

  // Incompatible sets are marked in words and ranked after the compatible ones unless the brief allows them (incompatible-sets.ts).
  for (const w of distinct) {
    w.candidate.incompatibilities = candidateIncompatibilities(w.candidate, byId, input.chemistry, w.candidate.verification.endTempC ?? brief.targetTempC);
    w.incompatible = w.candidate.incompatibilities.length > 0;
  }
  const ranked = rankCandidates(distinct, brief.objective, { allowIncompatible: brief.allowIncompatible });
  const pareto = paretoFlags(ranked);
  const candidates = ranked.map((w, i) => ({ ...w.candidate, rank: i + 1, pareto: pareto[i]! }));
  const excludedIngredients = enumeration.excluded.map((e) => ({ ingredientId: e.ingredientId, name: e.name, reason: e.reason }));
  const runWarnings = [...warnings.values()];
  if (unsettled > 0) {
    runWarnings.push({
      code: 'optimiser.enthalpy-not-settled',
      message: `${unsettled} set(s) did not settle in the enthalpy-of-solution iteration; their figures are from the last pass (see each candidate's enthalpyIteration)`,
    });
  }
  return {
    status: cancelled ? 'cancelled' : 'completed',
    objective: brief.objective,
    objectiveUnit: unitOfObjective(ctx),
    candidates,
    infeasible,
    excludedIngredients,
    stats: {
      setsEnumerated: sets.length,
      setsSolved: solvedSets.length,
      lpsSolved: counter.count,
      feasibleSets: working.length,
      verified,
      unsettledSets: unsettled,
      correctedSets,
      steps: done,
    },
    warnings: runWarnings,
    ...(options.keepSolvedSets ? { solvedSets } : {}),
  };
}

/** Most times a missed set's heat budget is corrected and the set solved again. */
export const MAX_CORRECTION_ROUNDS = 3;

/**
 * How much heat to add to a missed set's heat-budget row, J, from what the simulation found
 * (DEVELOPERS.md, "Optimiser: closing the loop"): a short hold asks for its shortfall at the
 * exchange rate at the target with 50 % to spare (the linear model leaks at the target for the
 * whole hold, the simulated pack leaks more while it is colder or warmer than the target), a
 * late or missed reach for a quarter of the budget; at least 5 % of the budget per round.
 * Null when more heat cannot help: the miss is a surface limit (more heat makes it worse) or
 * the simulation failed.
 */
export function correctionStep(model: LinearModel, v: Verification, brief: Brief): number | null {
  if (v.status !== 'missed') return null;
  const surface = v.reasons.some((r) => r.includes('surface limit'));
  if (surface) return null;
  const budget = Math.max(Math.abs(model.heatBudgetJ), 1);
  let step = 0;
  const shortMin = v.holdMarginMin !== null && v.holdMarginMin < 0 ? -v.holdMarginMin : 0;
  if (shortMin > 0) step += 1.5 * shortMin * model.exchangeJPerMin;
  if (v.timeToTargetMin === null || v.timeToTargetMin > brief.reachWithinMin) step += 0.25 * budget;
  return Math.max(step, 0.05 * budget);
}


/**
 * One chemistry port per library object, reused by later runs in the same process: the port
 * samples each solute's curves on first use (tens to hundreds of ms per solute), and a memo
 * keyed by the (read-only) library changes no result.
 */
function unitOfObjective(ctx: ThermalContext): string {
  if (ctx.objective === 'least-cost') return 'currency';
  if (ctx.objective === 'least-mass') return 'g';
  return Math.abs(ctx.uaWPerK * (ctx.envTempC - ctx.targetTempC)) > 0 ? 'min' : 'kJ';
}

/**
 * Why an active cannot help a brief, or null when it can: its useful heat per gram at the target
 * ({@link usefulHeatJPerG}, counting its own sensible heat) is not positive at either the
 * saturated or the infinitely dilute concentration.
 */
export function uselessReason(p: ParsedIngredient, ctx: ThermalContext, port: ChemistryPort): string | null {
  const sat = saturationEstimate([p], ctx.targetTempC);
  const estimates = [sat ?? { nH2O_per_mol: Infinity, soluteMassFraction: 0 }, { nH2O_per_mol: Infinity, soluteMassFraction: 0 }];
  let best = -Infinity;
  let heat = 0;
  let melting: number | null = null;
  for (const est of estimates) {
    const c = ingredientCoefficients(p, ctx.targetTempC, est, port);
    best = Math.max(best, usefulHeatJPerG(c, ctx, ctx.targetTempC));
    heat = c.heatAbsorbedJPerG;
    melting = c.meltingPointC;
  }
  if (best > 0) return null;
  if (melting !== null && ctx.targetTempC >= melting) return `crystallises at ${melting} °C, not above the ${ctx.targetTempC} °C target`;
  const cold = ctx.packType === 'cold';
  if (cold ? heat <= 0 : heat >= 0) return cold ? 'releases heat: cannot help a cold pack' : 'absorbs heat: cannot help a warm pack';
  return `${cold ? 'absorbs' : 'releases'} too little heat to bring even its own mass to ${ctx.targetTempC} °C`;
}

function activeNames(model: LinearModel): string[] {
  return model.set.members.filter((m) => model.set.activeIds.includes(m.id)).map((m) => m.name);
}

function toWorking(it: IteratedSet, ctx: ThermalContext): Working {
  const m = it.model;
  const x = it.solution.massesG;
  const fill = x.reduce((a, b) => a + b, 0);
  const cost = x.reduce((a, v, i) => a + v * m.coefficients[i]!.costPerG, 0) + ctx.packaging.cost;
  const heatRow = m.constraints.find((c) => c.id === 'heat-budget')!;
  const surplus = rowValue(heatRow, x) - heatRow.rhs;
  // Adiabatic extreme of the linear model: T = T₀ − (Σh·m − Σ(c_f − c_0)(25 − T₀)·m)/(Σc_f·m + C_pack).
  let h = 0;
  let k = 0;
  let cf = ctx.packaging.heatCapacityJPerK;
  m.coefficients.forEach((c, i) => {
    h += c.heatAbsorbedJPerG * x[i]!;
    k += (c.cpFinalJPerGK - c.cpInitialJPerGK) * (REFERENCE_TEMP_C - ctx.initialTempC) * x[i]!;
    cf += c.cpFinalJPerGK * x[i]!;
  });
  const extreme = cf > 0 ? ctx.initialTempC - (h - k) / cf : ctx.initialTempC;
  const eps = 1e-6 * Math.max(fill, 1e-9);
  const grams = gramsByIngredient(m.coefficients, x);
  const effectiveActives = m.set.activeIds.filter((id) => (grams.find((g) => g.ingredient.id === id)?.massG ?? 0) > eps);
  const composition = grams.map((g) => ({ ingredientId: g.ingredient.id, name: g.ingredient.name, role: g.ingredient.role, massG: g.massG }));
  const ingredientCount = composition.filter((c) => c.massG > eps).length;
  const predictedHoldMarginMin = m.exchangeJPerMin > 0 ? surplus / m.exchangeJPerMin : null;
  const binding = it.solution.binding.map((id) => {
    const row = m.constraints.find((c) => c.id === id)!;
    return { id, kind: row.kind, label: row.label };
  });
  const verification: Verification = {
    status: 'not-verified',
    reasons: [],
    timeToTargetMin: null,
    minutesInBand: null,
    minTempC: null,
    maxTempC: null,
    endTempC: null,
    holdMarginMin: null,
  };
  const candidate: Candidate = {
    setIds: m.set.activeIds,
    setNames: activeNames(m),
    composition,
    fillMassG: fill,
    massG: fill + ctx.packaging.massG,
    unitCost: cost.toFixed(4),
    unitCostValue: cost,
    heatSurplusJ: surplus,
    predictedHoldMarginMin,
    predictedExtremeTempC: extreme,
    predictedMinTempC: null,
    predictedMaxTempC: null,
    minutesInBand: null,
    objectiveValue: objectiveValue(m, x),
    bindingConstraints: binding,
    verification,
    pareto: false,
    rank: 0,
    hazardScore: 0,
    sensitivity: [],
    enthalpyIteration: { iterations: it.iterations, settled: it.settled, lastRelativeChange: it.lastRelativeChange },
    warnings: dedupeWarnings(m.coefficients.flatMap((c) => c.warnings.map((w) => ({ code: w.code, message: `${c.ingredient.name}: ${w.message}` })))),
  };
  if (!it.settled) {
    candidate.warnings.push({
      code: 'optimiser.enthalpy-not-settled',
      message: `the enthalpy-of-solution iteration stopped after ${it.iterations} passes with a last relative change of ${it.lastRelativeChange.toExponential(1)}; figures are from the last pass`,
    });
  }
  return {
    key: m.set.key,
    objectiveValue: candidate.objectiveValue,
    unitCostValue: cost,
    massG: candidate.massG,
    holdMarginMin: predictedHoldMarginMin,
    hazardScore: 0,
    verificationStatus: 'not-verified',
    activeCount: effectiveActives.length,
    setSize: m.set.activeIds.length,
    ingredientCount,
    iterated: it,
    candidate,
    effectiveKey: effectiveActives.join('+'),
  };
}

function dedupeWarnings(ws: readonly OptimiserWarning[]): OptimiserWarning[] {
  const seen = new Map<string, OptimiserWarning>();
  for (const w of ws) if (!seen.has(`${w.code}|${w.message}`)) seen.set(`${w.code}|${w.message}`, { code: w.code, message: w.message });
  return [...seen.values()];
}

function applyVerification(w: Working, v: Verification): void {
  w.candidate.verification = v;
  w.verificationStatus = v.status;
  w.candidate.predictedMinTempC = v.minTempC;
  w.candidate.predictedMaxTempC = v.maxTempC;
  w.candidate.minutesInBand = v.minutesInBand;
  if (v.holdMarginMin !== null) w.holdMarginMin = v.holdMarginMin;
}
