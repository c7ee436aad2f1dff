// `npm start`: PostgreSQL on 127.0.0.1 with its data under .data/, migrations, the demo seed,
// the local mail sink, a fresh front-end build, and the app on http://127.0.0.1:$PORT.
import path from 'node:path';
import { buildFrontendIfStale, root } from './lib/env';
import { ensureDatabase, startPostgres, type LocalPostgres } from './lib/postgres';

const dataDir = process.env.DATA_DIR ?? path.join(root, '.data');
const pgPort = Number(process.env.PGPORT ?? 54329);
const database = process.env.PGDATABASE ?? 'packwright';

let pg: LocalPostgres;
try {
  pg = startPostgres({ dataDir: path.join(dataDir, 'pg'), port: pgPort, passwordFile: path.join(dataDir, 'pg-password') });
} catch (error) {
  // A problem the user can act on, in a line or two, not a stack trace.
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
}
let stopping = false;
async function stopDatabase() {
  if (pg.startedHere) {
    pg.stop();
    console.log('[db] PostgreSQL stopped');
  }
}

try {
  await ensureDatabase(pg, database);
  process.env.DATABASE_URL ??= pg.url(database);
  process.env.DATA_DIR = dataDir;
  process.env.NODE_ENV ??= 'development';
  await buildFrontendIfStale();
  // The back end reads its configuration on import, so it is loaded only now.
  const { startServer } = await import('../backend/src/server');
  const running = await startServer();
  console.log(`\nPackwright is running at ${running.url}`);
  console.log('Demo sign-ins (password packwright-demo): admin@demo.test, designer@demo.test, chemist@demo.test, reviewer@demo.test');
  if (running.mailSinkPort) console.log(`Local mail sink on 127.0.0.1:${running.mailSinkPort}; read it at ${running.url}/admin/mail`);
  console.log('Press Ctrl-C to stop.');
  const shutdown = async () => {
    if (stopping) return;
    stopping = true;
    console.log('\n[packwright] stopping ...');
    await running.stop().catch((e: unknown) => console.error(e));
    await stopDatabase();
    process.exit(0);
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  await stopDatabase();
  process.exit(1);
}
