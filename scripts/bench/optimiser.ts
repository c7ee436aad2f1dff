/**
 * Optimiser benchmark. Prints:
 * (a) the full demo run: every 1–3-active set of the demo library (30 ingredients) for the
 *     sideline cold compress, the top 20 verified with the time model — wall time (first run with
 *     a fresh chemistry port, then the median of warm runs) and LPs solved per second; the four
 *     demo briefs together as well;
 * (b) the final LP of every set solved again by javascript-lp-solver and by HiGHS (one loaded
 *     module, one persistent model reloaded per LP), the time ratio, and the largest relative
 *     difference between the two optima;
 * (c) a brute-force search over compositions at 1 g resolution for a two-active brief, against
 *     the LP of the same set (same coefficients): time ratio, and whether the LP optimum is at
 *     least as good as the best grid point.
 *
 * Run: `npx tsx scripts/bench/optimiser.ts`, or call runOptimiserBench() (npm run bench).
 */
import { defaultChemistryLibrary } from '../../shared/src/chemistry';
import { DEMO_BRIEFS, DEMO_LIBRARY } from '../../shared/src/demo/demo-library';
import { objectiveValue, rowValue, type LinearModel } from '../../shared/src/optimiser/linear-model';
import { correctedPassShare, sumPassShares, type CorrectedPassShare } from '../../shared/src/optimiser/pass-share';
import { runOptimisation, type RunOptimisationOutput } from '../../shared/src/optimiser/run-optimisation';
import { solveLp, toLpProblem, type LpProblem } from '../../shared/src/optimiser/solve-set';
import { chemistryPort } from '../../shared/src/thermal/chemistry-adapter';
import { disposeHighsModel, highsModule, solveWithHighs } from '../../tests/reference/optimiser-highs';

export interface OptimiserBenchReport {
  fullRun: {
    brief: string;
    libraryIngredients: number;
    activesUsable: number;
    sets: number;
    lps: number;
    verified: number;
    coldMs: number;
    warmMedianMs: number;
    lpsPerSecond: number;
    allDemoBriefsMs: number;
    /** Over the demo briefs' simulated sets (top 20 each): how many pass with their corrected optimum. */
    passShare: CorrectedPassShare;
  };
  highs: { lps: number; jsLpMs: number; highsMs: number; ratioHighsOverJsLp: number; largestRelativeDifference: number };
  grid: { brief: string; points: number; gridMs: number; lpMs: number; ratioGridOverLp: number; lpObjective: number; gridBest: number; lpAtLeastAsGood: boolean | null };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

export async function runOptimiserBench(log: (line: string) => void = console.log): Promise<OptimiserBenchReport> {
  const lib = defaultChemistryLibrary();
  const brief = DEMO_BRIEFS[0]!;
  const input = { brief: { ...brief, maxActives: 3 }, ingredients: DEMO_LIBRARY, chemistry: lib };

  // (a) Full demo run.
  let t = performance.now();
  const first = runOptimisation(input, { verifyTop: 20 });
  const coldMs = performance.now() - t;
  const port = chemistryPort(lib);
  runOptimisation(input, { port, verifyTop: 20 });
  const warm: number[] = [];
  let run: RunOptimisationOutput = first;
  for (let k = 0; k < 5; k++) {
    t = performance.now();
    run = runOptimisation(input, { port, verifyTop: 20, keepSolvedSets: true });
    warm.push(performance.now() - t);
  }
  const warmMedianMs = median(warm);
  t = performance.now();
  const shares = DEMO_BRIEFS.map((b) => correctedPassShare(runOptimisation({ brief: b, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, verifyTop: 20 })));
  const allDemoBriefsMs = performance.now() - t;
  const passShare = sumPassShares(shares);
  const usable = DEMO_LIBRARY.filter((i) => i.role === 'active').length - run.excludedIngredients.length;
  const fullRun = {
    brief: brief.name,
    libraryIngredients: DEMO_LIBRARY.length,
    activesUsable: usable,
    sets: run.stats.setsEnumerated,
    lps: run.stats.lpsSolved,
    verified: run.stats.verified,
    coldMs,
    warmMedianMs,
    lpsPerSecond: run.stats.lpsSolved / (warmMedianMs / 1000),
    allDemoBriefsMs,
    passShare,
  };
  log(`(a) full demo run: "${brief.name}", library of ${fullRun.libraryIngredients} ingredients (${usable} actives usable for the brief, ${run.excludedIngredients.length} left out as unable to help),`);
  log(`    ${fullRun.sets} sets of 1–3 actives, ${fullRun.lps} LPs, top ${fullRun.verified} verified with the time model`);
  log(`    wall time ${coldMs.toFixed(0)} ms with a fresh chemistry port, ${warmMedianMs.toFixed(0)} ms median of 5 warm runs → ${fullRun.lpsPerSecond.toFixed(0)} LPs/s (whole run incl. verification)`);
  log(`    all ${DEMO_BRIEFS.length} demo briefs, warm: ${allDemoBriefsMs.toFixed(0)} ms; sets whose corrected optimum passes: ${passShare.passed} of ${passShare.simulated}`);

  // (b) The same LPs with HiGHS.
  const problems: LpProblem[] = (run.solvedSets ?? []).map((s) => toLpProblem(s.model));
  const highs = await highsModule();
  for (const p of problems.slice(0, 20)) {
    solveLp(p);
    solveWithHighs(highs, p);
  }
  t = performance.now();
  const ours = problems.map((p) => solveLp(p));
  const jsLpMs = performance.now() - t;
  t = performance.now();
  const theirs = problems.map((p) => solveWithHighs(highs, p));
  const highsMs = performance.now() - t;
  disposeHighsModel();
  let largest = 0;
  problems.forEach((_, i) => {
    const a = ours[i]!;
    const b = theirs[i]!;
    if (a.status !== b.status) largest = Infinity;
    else if (a.status === 'optimal') largest = Math.max(largest, Math.abs(a.objective - b.objective) / Math.max(Math.abs(b.objective), 1e-12));
  });
  const highsReport = { lps: problems.length, jsLpMs, highsMs, ratioHighsOverJsLp: highsMs / jsLpMs, largestRelativeDifference: largest };
  log(`(b) the final LP of each of the ${problems.length} sets: javascript-lp-solver ${jsLpMs.toFixed(1)} ms (${((jsLpMs / problems.length) * 1000).toFixed(1)} µs/LP), HiGHS ${highsMs.toFixed(1)} ms (${((highsMs / problems.length) * 1000).toFixed(1)} µs/LP, one persistent model reloaded per LP)`);
  log(`    time ratio HiGHS/javascript-lp-solver ${highsReport.ratioHighsOverJsLp.toFixed(2)}; largest relative difference of the optima ${largest.toExponential(2)}`);

  // (c) Brute-force grid at 1 g for a two-active brief. The pair must be feasible for the brief,
  // or the comparison proves nothing: take the first feasible pair of these, and fail loudly if none is.
  const pairs = [['urea', 'ammonium-nitrate'], ['urea', 'ammonium-chloride'], ['ammonium-nitrate', 'ammonium-chloride'], ['urea', 'potassium-chloride']];
  const gridBrief = { ...brief, name: 'two-active compress', maxActives: 2, maxMassG: 250, maxUnitCost: null, allowedIngredientIds: [] as string[] };
  let pair: NonNullable<RunOptimisationOutput['solvedSets']>[number] | undefined;
  for (const ids of pairs) {
    gridBrief.allowedIngredientIds = ids;
    const gridRun = runOptimisation({ brief: gridBrief, ingredients: DEMO_LIBRARY, chemistry: lib }, { port, verifyTop: 0, keepSolvedSets: true });
    pair = gridRun.solvedSets!.find((s) => s.set.activeIds.length === 2 && s.solution.status === 'optimal');
    if (pair) break;
  }
  if (!pair) throw new Error(`(c) none of the pairs ${pairs.map((p) => p.join('+')).join(', ')} is feasible for the grid brief: the brute-force comparison would prove nothing`);
  const model = pair.model;
  t = performance.now();
  for (let k = 0; k < 20; k++) solveLp(toLpProblem(model));
  const lpMs = (performance.now() - t) / 20;
  const lpObjective = objectiveValue(model, pair.solution.massesG);
  t = performance.now();
  const grid = bruteForce(model);
  const gridMs = performance.now() - t;
  const sense = model.objective.sense;
  // Optima are compared only between feasible answers: a grid with no feasible 1 g point says so.
  const lpAtLeastAsGood = grid.best === null ? null : sense === 'min' ? lpObjective <= grid.best + 1e-9 * Math.abs(grid.best) : lpObjective >= grid.best - 1e-9 * Math.abs(grid.best);
  if (lpAtLeastAsGood === false) throw new Error(`(c) the LP optimum ${lpObjective} is worse than the 1 g grid's ${grid.best}: the LP is wrong`);
  const gridReport = {
    brief: `${gridBrief.name} (${pair.set.activeIds.join(' + ')} + water, ≤ ${gridBrief.maxMassG} g)`,
    points: grid.points,
    gridMs,
    lpMs,
    ratioGridOverLp: gridMs / lpMs,
    lpObjective,
    gridBest: grid.best ?? NaN,
    lpAtLeastAsGood,
  };
  log(`(c) brute force at 1 g over ${gridReport.brief}: ${grid.points.toLocaleString('en')} compositions in ${gridMs.toFixed(0)} ms; the LP of the same set ${(lpMs * 1000).toFixed(0)} µs → ratio ${gridReport.ratioGridOverLp.toExponential(2)}`);
  log(
    grid.best === null
      ? `    no 1 g grid point satisfies every row (the LP optimum ${lpObjective.toFixed(6)} ${model.objective.unit} lies between grid points): no comparison of optima`
      : `    best grid point ${grid.best.toFixed(6)} ${model.objective.unit}, LP optimum ${lpObjective.toFixed(6)} ${model.objective.unit}: LP at least as good — yes`,
  );
  return { fullRun, highs: highsReport, grid: gridReport };
}

/** Every composition of the set's variables in whole grams within the mass row; the best that satisfies every row. */
function bruteForce(model: LinearModel): { points: number; best: number | null } {
  const n = model.coefficients.length;
  const massRow = model.constraints.find((c) => c.kind === 'total-mass')!;
  const maxG = Math.floor(massRow.rhs);
  const rows = model.constraints;
  const x = new Array<number>(n).fill(0);
  let points = 0;
  let best: number | null = null;
  const sense = model.objective.sense;
  const visit = (i: number, left: number) => {
    if (i === n - 1) {
      for (let g = 0; g <= left; g++) {
        x[i] = g;
        points++;
        let ok = true;
        for (const r of rows) {
          const v = rowValue(r, x);
          if (r.sense === 'le' ? v > r.rhs + 1e-9 * Math.max(1, Math.abs(r.rhs)) : v < r.rhs - 1e-9 * Math.max(1, Math.abs(r.rhs))) {
            ok = false;
            break;
          }
        }
        if (!ok) continue;
        const o = objectiveValue(model, x);
        if (best === null || (sense === 'min' ? o < best : o > best)) best = o;
      }
      return;
    }
    for (let g = 0; g <= left; g++) {
      x[i] = g;
      visit(i + 1, left - g);
    }
    x[i] = 0;
  };
  visit(0, maxG);
  return { points, best };
}

const isMain = import.meta.url === `file://${process.argv[1]}`;
if (isMain) {
  runOptimiserBench().catch((e: unknown) => {
    console.error(e);
    process.exitCode = 1;
  });
}
