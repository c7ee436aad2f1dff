import type { ChemistryLibrary } from '../chemistry/types';
import { chemistryPort } from '../thermal/chemistry-adapter';
import type { ChemistryPort } from '../thermal/chemistry-port';

/**
 * The one cache of the chemistry model (the port over a library, with its sampled curves and the
 * chemistry layer's memo tables hanging on the library object it keeps), keyed by the library's
 * revision: a hash of its content, so two equal libraries — the same workspace's data loaded for
 * two requests, a run's snapshot and the live data before any edit, two workspaces without their
 * own species — share one model, and any change of a species or a series gives a new one.
 * Least recently used models beyond {@link CHEMISTRY_CACHE_SIZE} are dropped.
 */
export const CHEMISTRY_CACHE_SIZE = 16;

const models = new Map<string, ChemistryPort>();
const revisions = new WeakMap<ChemistryLibrary, string>();

/**
 * A content revision of a library: FNV-1a (32-bit, twice with two offsets, Fowler–Noll–Vo;
 * public domain) over its JSON, with the length. Remembered per library object.
 *
 * @example libraryRevision(defaultChemistryLibrary()) // e.g. '3f0c9a12-8b77e1d0-412873'
 */
export function libraryRevision(lib: ChemistryLibrary): string {
  const known = revisions.get(lib);
  if (known) return known;
  const text = JSON.stringify(lib);
  let a = 0x811c9dc5;
  let b = 0x01000193 ^ 0x5bd1e995;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    a = Math.imul(a ^ c, 0x01000193);
    b = Math.imul(b ^ c, 0x01000193);
  }
  const rev = `${(a >>> 0).toString(16)}-${(b >>> 0).toString(16)}-${text.length}`;
  revisions.set(lib, rev);
  return rev;
}

/** The chemistry model of a library, built once per revision. */
export function chemistryModelFor(lib: ChemistryLibrary): ChemistryPort {
  const rev = libraryRevision(lib);
  const hit = models.get(rev);
  if (hit) {
    models.delete(rev);
    models.set(rev, hit);
    return hit;
  }
  const port = chemistryPort(lib);
  models.set(rev, port);
  while (models.size > CHEMISTRY_CACHE_SIZE) models.delete(models.keys().next().value!);
  return port;
}

/** A library or a ready port → the port (libraries through the cache). */
export function portOf(chemistry: ChemistryLibrary | ChemistryPort): ChemistryPort {
  return isLibrary(chemistry) ? chemistryModelFor(chemistry) : chemistry;
}

function isLibrary(x: ChemistryLibrary | ChemistryPort): x is ChemistryLibrary {
  return Array.isArray((x as ChemistryLibrary).species);
}
