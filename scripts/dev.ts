// `npm run dev`: the API (restarting on change) and Vite's dev server with a proxy to it, on the
// same PostgreSQL and .data/ as `npm start`.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { bin, root } from './lib/env';
import { ensureDatabase, startPostgres } from './lib/postgres';

const dataDir = process.env.DATA_DIR ?? path.join(root, '.data');
const pg = startPostgres({ dataDir: path.join(dataDir, 'pg'), port: Number(process.env.PGPORT ?? 54329), passwordFile: path.join(dataDir, 'pg-password') });
await ensureDatabase(pg, process.env.PGDATABASE ?? 'packwright');
const vitePort = process.env.VITE_PORT ?? '5173';
const env = {
  ...process.env,
  NODE_ENV: 'development',
  DATA_DIR: dataDir,
  DATABASE_URL: process.env.DATABASE_URL ?? pg.url(process.env.PGDATABASE ?? 'packwright'),
  APP_URL: process.env.APP_URL ?? `http://127.0.0.1:${vitePort}`,
  VITE_PORT: vitePort,
};
const children = [
  spawn(bin('tsx'), ['watch', '--clear-screen=false', path.join(root, 'backend', 'src', 'server.ts')], { cwd: root, stdio: 'inherit', env }),
  spawn(bin('vite'), [], { cwd: root, stdio: 'inherit', env }),
];
let stopping = false;
function stop() {
  if (stopping) return;
  stopping = true;
  for (const child of children) child.kill('SIGTERM');
  setTimeout(() => {
    if (pg.startedHere) pg.stop();
    process.exit(0);
  }, 1500);
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
for (const child of children) child.on('exit', stop);
