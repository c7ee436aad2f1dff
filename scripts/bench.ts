// `npm run bench`: the benchmarks of this machine, in one run, printed as a table of figures and
// ratios:
//   (a) the full demo run (every 1–3-active set of the demo library, top 20 verified): cold and warm
//       wall time, LPs per second;
//   (b) the same LPs with HiGHS: time ratio and the largest relative difference of the optima;
//   (c) the brute-force grid at 1 g for a two-active brief: time ratio, and whether the LP optimum is
//       at least as good;
//   (d) POST /api/mixtures/evaluate latency p50/p95 over a few hundred requests on loopback
//       (autocannon), against a throwaway PostgreSQL and server started here and removed after;
//   (e) a small run on a fresh optimisation thread (as each run once started) against the
//       process's long-lived thread;
//   (f) the full run on libraries of 30, 100 and 300 actives (grades of the demo actives), the
//       300/30 time ratio;
//   (g) the gzipped JavaScript the sign-in page and the home page load (scripts/bench/bundle.ts);
//   (h) GET /api/ingredients under 50 connections (autocannon) against a server in its own process,
//       beside the health route measured the same way in the same run, and their ratio
//       (scripts/bench/list-load.ts);
// then the memory of this process (RSS, heap).
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import os from 'node:os';
import path from 'node:path';
import { defaultChemistryLibrary } from '../shared/src/chemistry';
import { DEMO_BRIEFS, DEMO_LIBRARY } from '../shared/src/demo/demo-library';
import { briefSchema } from '../shared/src/schemas/briefs';
import { optimiseOnThread, stopOptimiseThread } from '../backend/src/runs/optimise-pool';
import { runLibraryScaleBench } from './bench/library-scale';
import { runOptimiserBench } from './bench/optimiser';
import { measureFirstScreens } from './bench/bundle';
import { measureListLoad, startBenchServer } from './bench/list-load';
import { bin, buildFrontendIfStale, freePort, root, runStep } from './lib/env';
import { ensureDatabase, startPostgres, type LocalPostgres } from './lib/postgres';

const rows: [string, string][] = [];
const section = (title: string) => rows.push([title, '']);
const row = (label: string, value: string) => rows.push([`  ${label}`, value]);
const ms = (x: number) => `${x.toFixed(x < 10 ? 2 : 0)} ms`;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const percentile = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))]!;
};

// --- (a)–(c): optimiser -----------------------------------------------------------------------
console.log('[bench] optimiser: full demo run, HiGHS on the same LPs, 1 g grid ...');
const opt = await runOptimiserBench(() => undefined);
section(`(a) full demo run — "${opt.fullRun.brief}", ${opt.fullRun.libraryIngredients} ingredients (${opt.fullRun.activesUsable} actives usable)`);
row('sets of 1–3 actives / LPs solved / verified', `${opt.fullRun.sets} / ${opt.fullRun.lps} / ${opt.fullRun.verified}`);
row('wall time, cold (first run in the process, fresh chemistry port)', ms(opt.fullRun.coldMs));
row('wall time, warm (median of 5)', ms(opt.fullRun.warmMedianMs));
row('LPs per second (warm, whole run incl. verification)', opt.fullRun.lpsPerSecond.toFixed(0));
row('all 4 demo briefs, warm', ms(opt.fullRun.allDemoBriefsMs));
row(
  'demo briefs: sets whose corrected optimum passes in simulation (top 20 each)',
  `${opt.fullRun.passShare.passed} of ${opt.fullRun.passShare.simulated} (${opt.fullRun.passShare.share === null ? '—' : `${(opt.fullRun.passShare.share * 100).toFixed(0)} %`})`,
);
section(`(b) the final LP of each of the ${opt.highs.lps} sets, javascript-lp-solver vs HiGHS`);
row('javascript-lp-solver', `${ms(opt.highs.jsLpMs)} (${((opt.highs.jsLpMs / opt.highs.lps) * 1000).toFixed(1)} µs/LP)`);
row('HiGHS (one persistent model reloaded per LP)', `${ms(opt.highs.highsMs)} (${((opt.highs.highsMs / opt.highs.lps) * 1000).toFixed(1)} µs/LP)`);
row('time ratio HiGHS / javascript-lp-solver', opt.highs.ratioHighsOverJsLp.toFixed(2));
row('largest relative difference of the optima', opt.highs.largestRelativeDifference.toExponential(2));

// --- (f): library scale ------------------------------------------------------------------------
console.log('[bench] library scale: 30, 100 and 300 actives ...');
const scale = runLibraryScaleBench([30, 100, 300], () => undefined);
section('(f) full run of the sideline compress on libraries of grades (every candidate simulated)');
for (const p of scale.points) row(`${p.actives} actives: sets (full → pruned) / candidates / wall time`, `${p.setsEnumerated.toLocaleString('en')} → ${p.setsAfterPruning} / ${p.candidates} / ${ms(p.wallMs)}`);
row('ratio of the 300 to the 30 time', scale.ratio300Over30.toFixed(2));
section(`(c) brute force at 1 g — ${opt.grid.brief}`);
row('grid points / grid time', `${opt.grid.points.toLocaleString('en')} / ${ms(opt.grid.gridMs)}`);
row('LP of the same set', `${(opt.grid.lpMs * 1000).toFixed(0)} µs`);
row('time ratio grid / LP', opt.grid.ratioGridOverLp.toExponential(2));
row(
  'LP optimum at least as good as the best grid point',
  opt.grid.lpAtLeastAsGood === null ? `no feasible 1 g grid point (LP ${opt.grid.lpObjective.toFixed(6)})` : `yes (LP ${opt.grid.lpObjective.toFixed(6)}, grid ${opt.grid.gridBest.toFixed(6)})`,
);

// --- (d): evaluate latency over HTTP ---------------------------------------------------------
console.log('[bench] POST /api/mixtures/evaluate: throwaway PostgreSQL and server ...');
interface AutocannonResult {
  requests: { total: number; average: number };
  non2xx: number;
  errors: number;
}
interface AutocannonInstance extends PromiseLike<AutocannonResult> {
  on(event: 'response', listener: (client: unknown, statusCode: number, resBytes: number, responseTimeMs: number) => void): void;
}
const autocannon = createRequire(import.meta.url)('autocannon') as (options: Record<string, unknown>) => AutocannonInstance;

const scratch = mkdtempSync(path.join(os.tmpdir(), 'packwright-bench-'));
chmodSync(scratch, 0o755); // the postgres user (when we are root) must reach the cluster
let pg: LocalPostgres | null = null;
let stopServer: (() => Promise<void>) | null = null;
try {
  const pgPort = await freePort();
  pg = startPostgres({ dataDir: path.join(scratch, 'pg'), port: pgPort, passwordFile: path.join(scratch, 'pg-password') });
  await ensureDatabase(pg, 'packwright_bench');
  const env = {
    NODE_ENV: 'test',
    DATABASE_URL: pg.url('packwright_bench'),
    DATA_DIR: scratch,
    MAIL_SINK_PORT: '0',
    WORKER_ENABLED: 'false',
    JWT_SECRET: `bench-secret-${Math.random().toString(36).slice(2)}-${Date.now()}-padding-padding`,
  };
  Object.assign(process.env, env);
  if ((await runStep('db', bin('tsx'), [path.join(root, 'scripts', 'db-setup.ts')], { ...process.env, ...env })) !== 0) throw new Error('database setup failed');
  // The back end reads its configuration on import: only now that the environment is set.
  const { startServer } = await import('../backend/src/server');
  const server = await startServer({ port: 0, migrate: false, seed: false, worker: false });
  stopServer = () => server.stop();
  const login = await fetch(`${server.url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'designer@demo.test', password: 'packwright-demo' }) });
  if (!login.ok) throw new Error(`sign-in failed: ${login.status} ${await login.text()}`);
  const { token } = (await login.json()) as { token: string };
  // The sideline compress's chemistry: ammonium nitrate in water, still air, 20 min hold.
  const body = JSON.stringify({
    components: [
      { formula: 'H2O', massG: 150 },
      { formula: 'NH4NO3', massG: 110 },
    ],
    initialTempC: 25,
    ambientC: 25,
    contact: { case: 'still-air', geometry: { areaM2: 0.03 } },
    packHeatCapacityJPerK: 20,
    holdMin: 20,
    targetBand: { minC: 2, maxC: 8 },
  });
  const check = await fetch(`${server.url}/api/mixtures/evaluate`, { method: 'POST', headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` }, body });
  if (!check.ok) throw new Error(`evaluate answered ${check.status}: ${await check.text()}`);
  const request = { url: `${server.url}/api/mixtures/evaluate`, method: 'POST', headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` }, body };
  await autocannon({ ...request, connections: 2, amount: 40 }); // warm-up
  const times: number[] = [];
  const instance = autocannon({ ...request, connections: 1, amount: 400 });
  instance.on('response', (_client, status, _bytes, t) => {
    if (status === 200) times.push(t);
  });
  const result = await instance;
  section(`(d) POST /api/mixtures/evaluate on loopback (autocannon, ${result.requests.total} requests, 1 connection)`);
  row('latency p50', ms(percentile(times, 50)));
  row('latency p95', ms(percentile(times, 95)));
  row('requests per second (average)', result.requests.average.toFixed(0));
  row('non-2xx answers / errors', `${result.non2xx} / ${result.errors}`);
} finally {
  await stopServer?.().catch((e: unknown) => console.error('[bench] stopping the server failed:', e));
  try {
    pg?.stop();
  } catch (error) {
    console.error('[bench] stopping PostgreSQL failed:', error);
  }
  rmSync(scratch, { recursive: true, force: true });
  if (pg && !pg.dataDir.startsWith(scratch)) rmSync(pg.dataDir, { recursive: true, force: true });
}

// --- (h): a list endpoint under load, against the health route --------------------------------
console.log('[bench] GET /api/ingredients and GET /api/health at 50 connections: throwaway PostgreSQL and server process ...');
{
  const loadServer = await startBenchServer();
  try {
    const load = await measureListLoad(loadServer.url, loadServer.token, { connections: 50, seconds: 10, serverPid: loadServer.pid });
    section(`(h) at ${load.ingredients.connections} connections for 10 s each (autocannon; the server in its own process)`);
    row(`GET /api/ingredients (${load.rows} rows, ${(load.bytes / 1024).toFixed(0)} KiB): requests per second`, load.ingredients.requestsPerSecond.toFixed(0));
    row('GET /api/ingredients: latency p50 / p99', `${load.ingredients.p50Ms} ms / ${load.ingredients.p99Ms} ms`);
    row('GET /api/health (SELECT 1): requests per second', load.health.requestsPerSecond.toFixed(0));
    row('GET /api/health: latency p50 / p99', `${load.health.p50Ms} ms / ${load.health.p99Ms} ms`);
    row('ratio ingredients / health (requests per second)', load.ratio.toFixed(2));
    const cpu = (x: number | null) => (x === null ? 'n/a' : `${x.toFixed(2)} ms`);
    row('server CPU per request: ingredients / health', `${cpu(load.ingredients.serverCpuMsPerRequest)} / ${cpu(load.health.serverCpuMsPerRequest)}`);
    row('non-2xx answers / errors', `${load.ingredients.non2xx + load.health.non2xx} / ${load.ingredients.errors + load.health.errors}`);
  } finally {
    await loadServer.stop();
  }
}

// --- (e): optimisation thread ----------------------------------------------------------------
console.log('[bench] optimisation thread: fresh per run vs long-lived ...');
const small = { brief: briefSchema.parse({ ...DEMO_BRIEFS[0]!, maxActives: 1 }), ingredients: [...DEMO_LIBRARY], chemistry: defaultChemistryLibrary() };
const runOnce = async (id: number) => {
  const t = performance.now();
  const o = await optimiseOnThread(id, small, () => undefined).outcome;
  if (o.type !== 'result') throw new Error(`bench run on the thread: ${o.type === 'error' ? o.message : o.type}`);
  return performance.now() - t;
};
const freshRuns: number[] = [];
for (let k = 0; k < 3; k++) {
  await stopOptimiseThread(); // as every run used to: a new thread, loader and JIT included
  freshRuns.push(await runOnce(k));
}
const keptRuns: number[] = [];
for (let k = 0; k < 5; k++) keptRuns.push(await runOnce(100 + k));
await stopOptimiseThread();
section(`(e) one small run (${small.brief.name}, 1 active) through an optimisation thread`);
row('on a fresh thread (median of 3)', ms(median(freshRuns)));
row('on the long-lived thread (median of 5)', ms(median(keptRuns)));
row('ratio fresh / long-lived', (median(freshRuns) / median(keptRuns)).toFixed(1));

// --- (g): first-load JavaScript --------------------------------------------------------------
console.log('[bench] first-load JavaScript from the build manifest ...');
await buildFrontendIfStale();
section('(g) JavaScript a first screen loads (entry + route modules + static imports, gzipped)');
for (const screen of measureFirstScreens(path.join(root, 'dist'))) {
  row(screen.screen, `${screen.gzipKiB.toFixed(1)} KiB in ${screen.files.length} files (largest ${screen.files[0]?.file ?? '—'} ${screen.files[0]?.gzipKiB.toFixed(1) ?? ''} KiB)`);
}

const mem = process.memoryUsage();
section('memory of this process after the run');
row('RSS', `${(mem.rss / 2 ** 20).toFixed(0)} MiB`);
row('heap used / heap total', `${(mem.heapUsed / 2 ** 20).toFixed(0)} / ${(mem.heapTotal / 2 ** 20).toFixed(0)} MiB`);

const width = Math.max(...rows.map(([l, v]) => (v ? l.length : 0)));
console.log(`\nPackwright benchmarks — ${os.cpus()[0]?.model ?? 'cpu'} × ${os.cpus().length}, Node ${process.version}\n`);
for (const [label, value] of rows) console.log(value ? `${label.padEnd(width)}  ${value}` : `\n${label}`);
process.exit(0);
