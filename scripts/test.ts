// `npm test`: the same bootstrap as `npm start`, on a throwaway cluster and ports (never .data/),
// then typecheck, lint, the unit/reference, API and browser suites. PostgreSQL is stopped and the
// throwaway folder removed at the end, on failure too.
import { chmodSync, existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { bin, buildFrontendIfStale, ensureChromium, freePort, root, runStep } from './lib/env';
import { ensureDatabase, startPostgres, type LocalPostgres } from './lib/postgres';

const args = process.argv.slice(2);
const onlyE2e = args.includes('--e2e');
const vitestArgs = args.filter((a) => a !== '--e2e');
const scratch = mkdtempSync(path.join(os.tmpdir(), 'packwright-test-'));
// The postgres user (when we are root) must be able to traverse into the cluster's folder.
chmodSync(scratch, 0o755);
let pg: LocalPostgres | null = null;
let exitCode = 1;

function cleanUp() {
  try {
    pg?.stop();
  } catch (error) {
    console.error('[db] stopping PostgreSQL failed:', error);
  }
  rmSync(scratch, { recursive: true, force: true });
  if (pg && !pg.dataDir.startsWith(scratch)) rmSync(pg.dataDir, { recursive: true, force: true });
}
process.on('SIGINT', () => {
  cleanUp();
  process.exit(130);
});

try {
  const pgPort = await freePort();
  pg = startPostgres({ dataDir: path.join(scratch, 'pg'), port: pgPort, passwordFile: path.join(scratch, 'pg-password') });
  await ensureDatabase(pg, 'packwright_test');
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: pg.url('packwright_test'),
    PG_ADMIN_URL: pg.url('postgres'),
    PG_DATA_DIR: pg.dataDir,
    PGPORT: String(pgPort),
    DATA_DIR: scratch,
    MAIL_SINK_PORT: '0',
    JWT_SECRET: `test-secret-${Math.random().toString(36).slice(2)}-${Date.now()}-padding-padding`,
    CHROMIUM_PATH: ensureChromium(),
    TEST_ARTIFACTS_DIR: path.join(root, '.test-artifacts'),
  };
  // Schema and demo seed once, as `npm start` does, before the suites run in parallel.
  const setup = await runStep('db', bin('tsx'), [path.join(root, 'scripts', 'db-setup.ts')], env);
  if (setup !== 0) throw new Error('database setup failed');
  await buildFrontendIfStale(env);

  const steps: [string, string, string[]][] = onlyE2e
    ? [['e2e', bin('vitest'), ['run', '--project', 'e2e', '--reporter=default', '--reporter=json', `--outputFile.json=${path.join(scratch, 'vitest.json')}`, ...vitestArgs]]]
    : [
        ['typecheck', bin('tsc'), ['--noEmit', '-p', 'tsconfig.json']],
        ['lint', bin('eslint'), ['--max-warnings', '0', '.']],
        ['tests', bin('vitest'), ['run', '--project', 'unit', '--project', 'api', '--project', 'e2e', '--reporter=default', '--reporter=json', `--outputFile.json=${path.join(scratch, 'vitest.json')}`, ...vitestArgs]],
        ['outage', bin('vitest'), ['run', '--project', 'outage', '--reporter=default', '--reporter=json', `--outputFile.json=${path.join(scratch, 'vitest-outage.json')}`]],
      ];
  exitCode = 0;
  for (const [label, cmd, cmdArgs] of steps) {
    const code = await runStep(label, cmd, cmdArgs, env);
    if (code !== 0) {
      console.error(`[${label}] failed with exit code ${code}`);
      exitCode = code;
    }
  }
  const totals = { passed: 0, failed: 0, skipped: 0 };
  for (const report of ['vitest.json', 'vitest-outage.json'].map((f) => path.join(scratch, f))) {
    if (!existsSync(report)) continue;
    const summary = JSON.parse(readFileSync(report, 'utf8')) as { numPassedTests: number; numFailedTests: number; numPendingTests: number };
    totals.passed += summary.numPassedTests;
    totals.failed += summary.numFailedTests;
    totals.skipped += summary.numPendingTests;
  }
  console.log(`\n${totals.passed} passed, ${totals.failed} failed, ${totals.skipped} skipped`);
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  exitCode = 1;
} finally {
  cleanUp();
}
process.exit(exitCode);
