/**
 * Lab-log benchmark. Prints:
 * (a) Monte Carlo confidence (200 samples) for each of the top 5 verified candidates of the
 *     demo sideline brief: ms per candidate, against the wall time of the optimisation run itself
 *     (the confidence is computed on demand per candidate, never inside the run);
 * (b) a Levenberg–Marquardt fit of UA, enthalpy factor and rate to a 45-min, 15-s synthetic log.
 *
 * Run: `npx tsx scripts/bench/lab-logs.ts`, or call runLabLogsBench() (npm run bench).
 */
import { pathToFileURL } from 'node:url';
import { defaultChemistryLibrary } from '../../shared/src/chemistry';
import { DEMO_BRIEFS, DEMO_LIBRARY } from '../../shared/src/demo/demo-library';
import { runOptimisation } from '../../shared/src/optimiser/run-optimisation';
import { briefSchema } from '../../shared/src/schemas/briefs';
import { chemistryModelFor } from '../../shared/src/evaluation/chemistry-cache';
import { componentsOf, linesOfComposition } from '../../shared/src/evaluation/components';
import { briefScenario, calibrateToLog, meetsBrief, monteCarloBand } from '../../shared/src/lab-logs';
import { syntheticSamples } from '../../shared/src/lab-logs/__fixtures__/synthetic-log';

export interface LabLogsBenchReport {
  runMs: number;
  confidence: { candidate: string; ms: number; probabilityMeetsBrief: number | null }[];
  meanConfidenceMs: number;
  fit: { ms: number; iterations: number; rmseK: number };
}

export function runLabLogsBench(): LabLogsBenchReport {
  const lib = defaultChemistryLibrary();
  const port = chemistryModelFor(lib);
  const brief = briefSchema.parse(DEMO_BRIEFS[0]);
  let t = performance.now();
  const result = runOptimisation({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { port });
  const runMs = performance.now() - t;
  const byId = new Map(DEMO_LIBRARY.map((i) => [i.id, i]));
  const confidence = result.candidates
    .filter((c) => c.verification.status !== 'not-verified')
    .slice(0, 5)
    .map((c) => {
      // The candidate's components as the evaluation core builds them (evaluation/components.ts).
      const components = componentsOf(linesOfComposition(c.composition, byId).lines);
      const s = performance.now();
      const mc = monteCarloBand(port, briefScenario(brief, components), { samples: 200, meets: (p) => meetsBrief(brief, p) });
      return { candidate: c.setNames.join(' + '), ms: performance.now() - s, probabilityMeetsBrief: mc.probabilityMeetsBrief };
    });
  const scenario = {
    components: [
      { key: 'water', massG: 120, process: { kind: 'inert' as const, role: 'water' as const } },
      { key: 'an', massG: 80, process: { kind: 'dissolution' as const, solidKey: 'NH4NO3(cr)' } },
    ],
    initialTempC: 24, ambientC: 24, contact: 'still-air' as const, packAreaM2: 0.03, packHeatCapacityJPerK: 24, horizonMin: 45,
  };
  const samples = syntheticSamples(port, scenario, { uaMultiplier: 1.3, enthalpyFactor: 0.95, rateMultiplier: 0.6, heatCapacityFactor: 1 }, { everySec: 15 });
  t = performance.now();
  const fit = calibrateToLog(port, scenario, samples);
  const fitMs = performance.now() - t;
  return {
    runMs,
    confidence,
    meanConfidenceMs: confidence.reduce((a, c) => a + c.ms, 0) / Math.max(1, confidence.length),
    fit: { ms: fitMs, iterations: fit.iterations, rmseK: fit.rmseK },
  };
}

export function printLabLogsBench(r: LabLogsBenchReport): void {
  console.log('Lab logs');
  console.log(`  optimisation run (sideline brief, demo library): ${r.runMs.toFixed(0)} ms`);
  for (const c of r.confidence) console.log(`  Monte Carlo 200 samples, ${c.candidate}: ${c.ms.toFixed(0)} ms, P(meets brief) = ${c.probabilityMeetsBrief?.toFixed(2)}`);
  console.log(`  mean per candidate: ${r.meanConfidenceMs.toFixed(0)} ms (${((100 * r.meanConfidenceMs) / r.runMs).toFixed(0)} % of the run; computed on demand, after the run)`);
  console.log(`  LM fit of UA, ΔH factor and rate to a 181-sample log: ${r.fit.ms.toFixed(0)} ms, ${r.fit.iterations} iterations, RMSE ${r.fit.rmseK.toFixed(3)} K`);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) printLabLogsBench(runLabLogsBench());
