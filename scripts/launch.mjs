#!/usr/bin/env node
// Entry point for `npm start`, `npm test`, `npm run dev` and `npm run worker` on a fresh clone:
// installs the npm packages when they are missing, then hands over to the TypeScript script.
// Plain JavaScript because TypeScript itself is one of the packages it may have to install.
import { spawnSync, spawn } from 'node:child_process';
import { existsSync, lstatSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const command = process.argv[2];
if (!command) {
  console.error('usage: node scripts/launch.mjs <start|test|dev|worker|bench> [args]');
  process.exit(2);
}

const marker = path.join(root, 'node_modules', '.package-lock.json');
const lock = path.join(root, 'package-lock.json');
const stale = !existsSync(marker) || statSync(lock).mtimeMs > statSync(marker).mtimeMs + 1000;
// A checkout whose node_modules is a link to another checkout's install (a git worktree, say)
// must not wipe that install with `npm ci`; it says so and goes on with what is there.
const linkedInstall = existsSync(path.join(root, 'node_modules')) && lstatSync(path.join(root, 'node_modules')).isSymbolicLink();
if (stale && linkedInstall) {
  console.warn('[setup] node_modules is a link to another install; not running npm ci here. Run it in the linked checkout if packages changed.');
} else if (stale) {
  console.log('[setup] installing npm packages (npm ci) ...');
  const result = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) {
    console.error('[setup] npm ci failed; see the messages above.');
    process.exit(result.status ?? 1);
  }
}

const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
const child = spawn(tsx, [path.join(root, 'scripts', `${command}.ts`), ...process.argv.slice(3)], { cwd: root, stdio: 'inherit' });
// Ctrl-C reaches the whole process group; the child cleans up and exits, and we follow it.
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => {});
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
