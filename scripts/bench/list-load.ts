// List endpoints under load: `GET /api/ingredients` (the demo designer's library) and the health
// route (`GET /api/health`, one `SELECT 1`) at 50 connections, served by a server in its own
// process so the load generator (autocannon, here) does not share its event loop.
//
// Alone: `npx tsx scripts/bench/list-load.ts [--cpu-prof]` starts a throwaway PostgreSQL, migrates
// and seeds it, starts the server (with `--cpu-prof`, the server writes a V8 CPU profile to
// .bench-profiles/ when it stops), measures and removes everything. `npm run bench` calls
// {@link measureListLoad} against a server it starts the same way.
import { spawn, type ChildProcess } from 'node:child_process';
import { chmodSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import os from 'node:os';
import path from 'node:path';
import { bin, freePort, root, runStep } from '../lib/env';
import { ensureDatabase, startPostgres, type LocalPostgres } from '../lib/postgres';

interface AutocannonResult {
  requests: { total: number; average: number };
  latency: { p50: number; p99: number; average: number };
  non2xx: number;
  errors: number;
  duration: number;
}
const autocannon = createRequire(import.meta.url)('autocannon') as (options: Record<string, unknown>) => PromiseLike<AutocannonResult>;

export interface LoadFigure {
  path: string;
  connections: number;
  requests: number;
  requestsPerSecond: number;
  p50Ms: number;
  p99Ms: number;
  non2xx: number;
  errors: number;
  /** The server process's CPU time (user + system) per answered request; null where /proc is missing. */
  serverCpuMsPerRequest: number | null;
}

/** CPU seconds (user + system) the process has used so far, from /proc (Linux); null elsewhere. */
function cpuSeconds(pid: number | undefined): number | null {
  if (!pid) return null;
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').replace(/^.*\) /, '').split(' ');
    // After the command name: field 14 utime and 15 stime of proc(5), in clock ticks (USER_HZ, 100 on Linux).
    return (Number(fields[11]) + Number(fields[12])) / 100;
  } catch {
    return null;
  }
}

async function load(url: string, token: string, route: string, connections: number, seconds: number, serverPid?: number): Promise<LoadFigure> {
  const headers = { authorization: `Bearer ${token}` };
  await autocannon({ url: `${url}${route}`, headers, connections, duration: 2 }); // warm-up: JIT, pools
  await new Promise((resolve) => setTimeout(resolve, 500)); // let the warm-up's queue drain
  const cpuBefore = cpuSeconds(serverPid);
  const r = await autocannon({ url: `${url}${route}`, headers, connections, duration: seconds });
  const cpuAfter = cpuSeconds(serverPid);
  return {
    serverCpuMsPerRequest: cpuBefore !== null && cpuAfter !== null && r.requests.total > 0 ? ((cpuAfter - cpuBefore) * 1000) / r.requests.total : null,
    path: route,
    connections,
    requests: r.requests.total,
    requestsPerSecond: r.requests.total / r.duration,
    p50Ms: r.latency.p50,
    p99Ms: r.latency.p99,
    non2xx: r.non2xx,
    errors: r.errors,
  };
}

/** The health route and the ingredient list at `connections`, one after the other, `seconds` each. */
export async function measureListLoad(url: string, token: string, options: { connections?: number; seconds?: number; serverPid?: number } = {}) {
  const connections = options.connections ?? 50;
  const seconds = options.seconds ?? 10;
  const check = await fetch(`${url}/api/ingredients`, { headers: { authorization: `Bearer ${token}` } });
  if (!check.ok) throw new Error(`GET /api/ingredients answered ${check.status}: ${await check.text()}`);
  const body = (await check.json()) as { total: number };
  const bytes = Number(check.headers.get('content-length') ?? 0);
  const health = await load(url, token, '/api/health', connections, seconds, options.serverPid);
  const ingredients = await load(url, token, '/api/ingredients', connections, seconds, options.serverPid);
  return { health, ingredients, rows: body.total, bytes, ratio: ingredients.requestsPerSecond / health.requestsPerSecond };
}

export interface BenchServer {
  url: string;
  token: string;
  pid: number | undefined;
  stop(): Promise<void>;
}

/** A throwaway PostgreSQL (migrated, demo-seeded) and a server in a child process, signed in as the demo designer. */
export async function startBenchServer(options: { nodeArgs?: string[] } = {}): Promise<BenchServer> {
  const scratch = mkdtempSync(path.join(os.tmpdir(), 'packwright-load-'));
  chmodSync(scratch, 0o755); // the postgres user (when we are root) must reach the cluster
  let pg: LocalPostgres | null = null;
  let child: ChildProcess | null = null;
  const cleanup = async () => {
    if (child && child.exitCode === null) {
      const exited = new Promise((resolve) => child!.once('exit', resolve));
      await new Promise((resolve) => setTimeout(resolve, 1500)); // let requests still queued after the load finish
      child.kill('SIGTERM');
      await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 10_000))]);
    }
    try {
      pg?.stop();
    } catch (error) {
      console.error('[bench] stopping PostgreSQL failed:', error);
    }
    rmSync(scratch, { recursive: true, force: true });
    if (pg && !pg.dataDir.startsWith(scratch)) rmSync(pg.dataDir, { recursive: true, force: true });
  };
  try {
    pg = startPostgres({ dataDir: path.join(scratch, 'pg'), port: await freePort(), passwordFile: path.join(scratch, 'pg-password') });
    await ensureDatabase(pg, 'packwright_load');
    const port = await freePort();
    const env = {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: pg.url('packwright_load'),
      DATA_DIR: scratch,
      PORT: String(port),
      MAIL_SINK_PORT: '0',
      WORKER_ENABLED: 'false',
      JWT_SECRET: `load-secret-${Math.random().toString(36).slice(2)}-${Date.now()}-padding-padding`,
    };
    if ((await runStep('db', bin('tsx'), [path.join(root, 'scripts', 'db-setup.ts')], env)) !== 0) throw new Error('database setup failed');
    child = spawn(process.execPath, [...(options.nodeArgs ?? []), '--import', 'tsx', path.join(root, 'backend', 'src', 'server.ts')], { cwd: root, env, stdio: ['ignore', 'inherit', 'inherit'] });
    const url = `http://127.0.0.1:${port}`;
    for (let i = 0; ; i++) {
      if (child.exitCode !== null) throw new Error(`the server exited with ${child.exitCode}`);
      const up = await fetch(`${url}/api/health`).then((r) => r.ok, () => false);
      if (up) break;
      if (i > 300) throw new Error('the server did not start within 60 s');
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
    const login = await fetch(`${url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'designer@demo.test', password: 'packwright-demo' }) });
    if (!login.ok) throw new Error(`sign-in failed: ${login.status} ${await login.text()}`);
    const { token } = (await login.json()) as { token: string };
    return { url, token, pid: child.pid, stop: cleanup };
  } catch (error) {
    await cleanup();
    throw error;
  }
}

const isMain = process.argv[1] && import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isMain) {
  const profile = process.argv.includes('--cpu-prof');
  const server = await startBenchServer({ nodeArgs: profile ? ['--cpu-prof', `--cpu-prof-dir=${path.join(root, '.bench-profiles')}`] : [] });
  try {
    const r = await measureListLoad(server.url, server.token, { serverPid: server.pid });
    for (const f of [r.health, r.ingredients]) {
      console.log(`${f.path.padEnd(18)} ${f.connections} connections: ${f.requestsPerSecond.toFixed(0)} req/s, p50 ${f.p50Ms} ms, p99 ${f.p99Ms} ms, non-2xx ${f.non2xx}, errors ${f.errors}, server CPU ${f.serverCpuMsPerRequest?.toFixed(2) ?? '?'} ms/request`);
    }
    console.log(`ingredients: ${r.rows} rows, ${r.bytes} bytes; ratio ingredients / health = ${r.ratio.toFixed(2)}`);
  } finally {
    await server.stop();
  }
  process.exit(0);
}
