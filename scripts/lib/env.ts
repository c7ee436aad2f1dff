import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
export const bin = (name: string) => path.join(root, 'node_modules', '.bin', name);

/** A free TCP port on 127.0.0.1, chosen by the kernel. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

/** Runs a command to completion, inheriting the terminal; resolves with its exit code. */
export function runStep(label: string, cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): Promise<number> {
  console.log(`\n[${label}] ${path.basename(cmd)} ${args.join(' ')}`);
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { cwd: root, stdio: 'inherit', env });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

function newestMtime(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === 'node_modules' || entry.name.startsWith('.')) continue;
    const full = path.join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(full) : statSync(full).mtimeMs);
  }
  return newest;
}

/** Builds the front end when dist/ is missing or older than its sources. */
export async function buildFrontendIfStale(env: NodeJS.ProcessEnv = process.env): Promise<void> {
  const index = path.join(root, 'dist', 'index.html');
  const sources = Math.max(newestMtime(path.join(root, 'frontend')), newestMtime(path.join(root, 'shared')), statSync(path.join(root, 'vite.config.ts')).mtimeMs);
  if (existsSync(index) && statSync(index).mtimeMs >= sources) return;
  const code = await runStep('build', bin('vite'), ['build', '--logLevel', 'warn'], env);
  if (code !== 0) throw new Error('The front-end build failed; see the messages above.');
}

/** Debian's Chromium for the browser tests: installed with apt-get when missing and we are root. */
export function ensureChromium(): string {
  const chromium = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  if (existsSync(chromium)) return chromium;
  if (process.getuid?.() !== 0) {
    throw new Error(`Chromium not found at ${chromium}. Install it: sudo apt-get install -y chromium (or set CHROMIUM_PATH).`);
  }
  console.log('[setup] installing Chromium for the browser tests (apt-get install chromium) ...');
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', 'chromium']]) {
    const r = spawnSync('apt-get', args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    if (r.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed`);
  }
  return chromium;
}
