// The JavaScript a first screen loads, from the Vite build manifest (dist/.vite/manifest.json):
// the entry (index.html) and the lazy route modules a page renders, each with every chunk it
// imports statically, gzipped as a browser would receive it. `npx tsx scripts/bench/bundle.ts`
// prints the figures after `npm run build`; `npm run bench` includes them.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  isDynamicEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
  css?: string[];
}
type Manifest = Record<string, ManifestChunk>;

/** The pages measured: the route modules (relative to frontend/) each renders on a direct load. */
export const FIRST_SCREENS: Record<string, string[]> = {
  'sign-in page': ['src/app/routes/sign-in.tsx'],
  'home page (signed in)': ['src/app/routes/app/root.tsx', 'src/app/routes/app/home.tsx'],
};

export interface ScreenBundle {
  screen: string;
  files: { file: string; gzipKiB: number }[];
  gzipKiB: number;
}

function closure(manifest: Manifest, keys: string[]): Set<string> {
  const seen = new Set<string>();
  const visit = (key: string) => {
    if (seen.has(key)) return;
    const chunk = manifest[key];
    if (!chunk) throw new Error(`The build manifest has no chunk for ${key}; run npm run build first.`);
    seen.add(key);
    for (const k of chunk.imports ?? []) visit(k);
  };
  for (const k of keys) visit(k);
  return seen;
}

/** Gzipped size of the JS each first screen loads, from the build in `distDir`. */
export function measureFirstScreens(distDir: string): ScreenBundle[] {
  const manifestFile = path.join(distDir, '.vite', 'manifest.json');
  if (!existsSync(manifestFile)) throw new Error(`No ${manifestFile}: run npm run build (vite.config.ts writes the manifest).`);
  const manifest = JSON.parse(readFileSync(manifestFile, 'utf8')) as Manifest;
  const entry = Object.entries(manifest).find(([, c]) => c.isEntry)?.[0];
  if (!entry) throw new Error('The build manifest has no entry chunk.');
  const sizes = new Map<string, number>();
  const gz = (file: string) => {
    if (!sizes.has(file)) sizes.set(file, gzipSync(readFileSync(path.join(distDir, file))).length / 1024);
    return sizes.get(file)!;
  };
  return Object.entries(FIRST_SCREENS).map(([screen, routes]) => {
    const keys = closure(manifest, [entry, ...routes]);
    const files = [...keys].map((k) => manifest[k]!.file).filter((f) => f.endsWith('.js')).map((file) => ({ file, gzipKiB: gz(file) }));
    files.sort((a, b) => b.gzipKiB - a.gzipKiB);
    return { screen, files, gzipKiB: files.reduce((s, f) => s + f.gzipKiB, 0) };
  });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const dist = process.argv[2] ? path.resolve(process.argv[2]) : path.resolve(import.meta.dirname, '..', '..', 'dist');
  for (const s of measureFirstScreens(dist)) {
    console.log(`${s.screen}: ${s.gzipKiB.toFixed(1)} KiB gzipped JS`);
    for (const f of s.files) console.log(`  ${f.gzipKiB.toFixed(1).padStart(6)}  ${f.file}`);
  }
}
