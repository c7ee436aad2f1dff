/**
 * Library-scale benchmark: the full run of the sideline compress (every 1–3-active set, every
 * candidate simulated) on libraries of about 30, 100 and 300 actives, made by adding grades of
 * the demo actives with varied, invented costs (a real library holds many grades and suppliers
 * of the same chemicals). Prints each wall time and the ratio of the 300 to the 30 time.
 *
 * Run: `npx tsx scripts/bench/library-scale.ts`, or call runLibraryScaleBench() (npm run bench).
 */
import { defaultChemistryLibrary } from '../../shared/src/chemistry';
import { DEMO_BRIEFS, DEMO_LIBRARY } from '../../shared/src/demo/demo-library';
import { runOptimisation } from '../../shared/src/optimiser/run-optimisation';
import type { OptimiserIngredient } from '../../shared/src/optimiser/types';
import { chemistryPort } from '../../shared/src/thermal/chemistry-adapter';

export interface LibraryScalePoint {
  actives: number;
  setsEnumerated: number;
  setsAfterPruning: number;
  candidates: number;
  wallMs: number;
}

/** The demo library grown to `actives` actives by grades of its own actives at 0.6–1.8 × cost (deterministic). */
export function gradedLibrary(actives: number): OptimiserIngredient[] {
  const base = DEMO_LIBRARY.filter((i) => i.role === 'active');
  const out = [...DEMO_LIBRARY];
  let seed = 12345;
  const next = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
  for (let k = 0; base.length + k < actives; k++) {
    const b = base[k % base.length]!;
    out.push({ ...b, id: `${b.id}~g${k}`, name: `${b.name}, supplier grade ${k + 1}`, costPerKg: (Number(b.costPerKg) * (0.6 + 1.2 * next())).toFixed(2) });
  }
  return out;
}

export function runLibraryScaleBench(sizes: readonly number[] = [30, 100, 300], log: (line: string) => void = console.log): { points: LibraryScalePoint[]; ratio300Over30: number } {
  const lib = defaultChemistryLibrary();
  const port = chemistryPort(lib);
  const brief = { ...DEMO_BRIEFS[0]!, maxActives: 3 };
  runOptimisation({ brief, ingredients: DEMO_LIBRARY, chemistry: lib }, { port }); // warm the port's curves
  const points: LibraryScalePoint[] = [];
  for (const n of sizes) {
    const ingredients = gradedLibrary(n);
    const t = performance.now();
    const r = runOptimisation({ brief, ingredients, chemistry: lib }, { port });
    const wallMs = performance.now() - t;
    const actives = ingredients.filter((i) => i.role === 'active').length;
    const k = actives - r.excludedIngredients.length;
    // Sets a full enumeration would try: Σ C(usable, 1..3), usable counting the pruned grades too.
    const pruned = r.excludedIngredients.filter((e) => e.reason.startsWith('same chemistry as')).length;
    const usable = k + pruned;
    const full = usable + (usable * (usable - 1)) / 2 + (usable * (usable - 1) * (usable - 2)) / 6;
    points.push({ actives, setsEnumerated: full, setsAfterPruning: r.stats.setsEnumerated, candidates: r.candidates.length, wallMs });
    log(`    ${actives} actives: ${full.toLocaleString('en')} sets by full enumeration, ${r.stats.setsEnumerated} after dominance pruning, ${r.candidates.length} candidates simulated, ${wallMs.toFixed(0)} ms`);
  }
  const first = points[0]!;
  const last = points[points.length - 1]!;
  return { points, ratio300Over30: last.wallMs / first.wallMs };
}

const isMain = import.meta.url === `file://${process.argv[1]}`;
if (isMain) {
  const r = runLibraryScaleBench();
  console.log(`ratio ${r.ratio300Over30.toFixed(2)}`);
}
