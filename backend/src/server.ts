import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { createApp, type AppOptions } from './app';
import { setListeningAddress } from './app-url';
import { config } from './config';
import { migrateUp } from './db/migrator';
import { seedDemo } from './db/seed';
import { sequelize } from './db/sequelize';
import { closeMailer, useMailSink } from './mail/mailer';
import { startMailSink, type MailSink } from './mail/mail-sink';
import { startMailWorker } from './mail/mail-queue';
import { executeRun } from './runs/run-executor';
import { startRunWorker, stopRunQueue } from './runs/run-queue';
import { startRunSweeper, stopRunSweeper } from './runs/run-sweeper';

export interface RunningServer {
  url: string;
  port: number;
  mailSinkPort: number | null;
  stop(): Promise<void>;
}

export interface StartOptions extends AppOptions {
  port?: number;
  migrate?: boolean;
  seed?: boolean;
  /** Serve the optimisation queue in this process (default: WORKER_ENABLED, true). */
  worker?: boolean;
}

/** Starts the whole back end: migrations, demo seed, the local mail sink, and the HTTP server on loopback. */
export async function startServer(options: StartOptions = {}): Promise<RunningServer> {
  await sequelize.authenticate();
  if (options.migrate ?? true) {
    const applied = await migrateUp();
    if (applied.length) console.log(`[db] applied migrations: ${applied.join(', ')}`);
  }
  if (options.seed ?? true) await seedDemo();

  let sink: MailSink | null = null;
  if (config.mail.sinkEnabled) {
    // A second instance on this machine finds the default port taken and takes a free one.
    sink = await startMailSink(config.mail.sinkPort, { fallbackWhenBusy: !config.mail.sinkPortExplicit });
    useMailSink(sink.port, sink.auth);
  }

  if (options.worker ?? config.workerEnabled) await startRunWorker(({ runId }) => executeRun(runId));
  // Every process looks for runs whose worker died, whether or not it serves the queue itself.
  startRunSweeper();

  // The app builds its routes (and registers their mail jobs) before the mail worker starts.
  const app = createApp(options);
  // Background mail (password-reset links) is always served by the app process.
  await startMailWorker();
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(options.port ?? config.port, config.host, () => resolve(s));
    s.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  const url = `http://${config.host}:${port}`;
  setListeningAddress(url);

  return {
    url,
    port,
    mailSinkPort: sink?.port ?? null,
    async stop() {
      server.closeAllConnections?.();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await sink?.close();
      await stopRunSweeper();
      await stopRunQueue();
      closeMailer();
      await sequelize.close();
    },
  };
}

const isMain = process.argv[1] && import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isMain) {
  const running = await startServer();
  console.log(`[packwright] serving on ${running.url}${running.mailSinkPort ? ` · mail sink on 127.0.0.1:${running.mailSinkPort}` : ''}`);
  const shutdown = async () => {
    await running.stop();
    process.exit(0);
  };
  process.once('SIGINT', shutdown);
  process.once('SIGTERM', shutdown);
}
