// The full fuzz probe: the suite of tests/api/fuzz.test.ts with 10,000 requests (or
// `--requests N`, `--seed S`) against a throwaway PostgreSQL it starts and removes, then the
// counts by status and any 5xx found. `npx tsx scripts/bench/fuzz.ts`; exits 1 on any 5xx.
import { chmodSync, existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { bin, freePort, root, runStep } from '../lib/env';
import { ensureDatabase, startPostgres, type LocalPostgres } from '../lib/postgres';

function arg(name: string, fallback: number): number {
  const at = process.argv.indexOf(`--${name}`);
  const value = at >= 0 ? Number(process.argv[at + 1]) : fallback;
  if (!Number.isInteger(value) || value <= 0) throw new Error(`--${name} must be a positive whole number`);
  return value;
}

const requests = arg('requests', 10_000);
const seed = arg('seed', 20261202);
const scratch = mkdtempSync(path.join(os.tmpdir(), 'packwright-fuzz-'));
chmodSync(scratch, 0o755); // the postgres user (when we are root) must reach the cluster
let pg: LocalPostgres | null = null;
let exitCode = 1;
try {
  const pgPort = await freePort();
  pg = startPostgres({ dataDir: path.join(scratch, 'pg'), port: pgPort, passwordFile: path.join(scratch, 'pg-password') });
  await ensureDatabase(pg, 'packwright_fuzz');
  const report = path.join(scratch, 'fuzz-report.json');
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: pg.url('packwright_fuzz'),
    DATA_DIR: scratch,
    MAIL_SINK_PORT: '0',
    WORKER_ENABLED: 'false',
    JWT_SECRET: `fuzz-secret-${Math.random().toString(36).slice(2)}-${Date.now()}-padding-padding`,
    FUZZ_REQUESTS: String(requests),
    FUZZ_SEED: String(seed),
    FUZZ_REPORT: report,
  };
  if ((await runStep('db', bin('tsx'), [path.join(root, 'scripts', 'db-setup.ts')], env)) !== 0) throw new Error('database setup failed');
  const code = await runStep('fuzz', bin('vitest'), ['run', '--project', 'api', '--hookTimeout', '300000', 'tests/api/fuzz.test.ts'], env);
  if (!existsSync(report)) throw new Error(`the fuzz suite wrote no report (exit code ${code})`);
  const result = JSON.parse(readFileSync(report, 'utf8')) as { requests: number; elapsedS: number; byStatus: Record<string, number>; serverErrors: number; serverErrorSamples: string[] };
  console.log(`\n[fuzz] ${result.requests} requests (seed ${seed}) in ${result.elapsedS.toFixed(1)} s: ${result.serverErrors} × 5xx`);
  console.log(`[fuzz] by status: ${Object.entries(result.byStatus).map(([s, n]) => `${s} × ${n}`).join(', ')}`);
  for (const sample of result.serverErrorSamples) console.log(`[fuzz] ${sample}`);
  exitCode = code === 0 && result.serverErrors === 0 ? 0 : 1;
} catch (error) {
  console.error('[fuzz] failed:', error);
} finally {
  try {
    pg?.stop();
  } catch (error) {
    console.error('[db] stopping PostgreSQL failed:', error);
  }
  rmSync(scratch, { recursive: true, force: true });
}
process.exit(exitCode);
